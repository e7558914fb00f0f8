/**
 * Exact superposition weights of resistive ladders (voltage mode).
 *
 * Node numbering: node 0 is the output (MSB) node, node N−1 the LSB node. Leg i joins node i to
 * a changeover switch that ends on an ideal source (V_REF or ground), so the conductance matrix
 * does not depend on the code and V_out / V_REF = Σ b_i w_i holds exactly, mismatch included.
 *
 * Method: the matrix is tridiagonal. Eliminating from the LSB end gives the resistance Z_i
 * looking from node i toward the LSB (Z_{N−1} = R_leg ∥ R_term, Z_i = R_leg,i ∥ (R_s,i + Z_{i+1})),
 * then the first column of G⁻¹ follows by a chain of voltage dividers: x_0 = Z_0,
 * x_{i+1} = x_i · Z_{i+1} / (R_s,i + Z_{i+1}). Every step adds, multiplies or divides positive
 * numbers, so there is no cancellation. w_i = x_i / R_leg,i (G is symmetric, so its first row
 * equals its first column). The hot paths allocate nothing.
 */

/**
 * Writes Z_i (ohms), the resistance seen from node i toward the LSB end (leg i included,
 * series link to node i−1 excluded), into `z[0..n−1]`: Z_{N−1} = R_leg ∥ R_term,
 * Z_i = R_leg,i ∥ (R_s,i + Z_{i+1}). One division per node.
 */
function impedanceTowardLsb(
  legsOhm: ArrayLike<number>,
  seriesOhm: ArrayLike<number>,
  terminationOhm: number,
  switchOhm: number,
  z: Float64Array
): void {
  const n = legsOhm.length
  const rLast = (legsOhm[n - 1] as number) + switchOhm
  let zNext = rLast * terminationOhm / (rLast + terminationOhm)
  z[n - 1] = zNext
  for (let i = n - 2; i >= 0; i--) {
    const rLeg = (legsOhm[i] as number) + switchOhm
    const rDown = (seriesOhm[i] as number) + zNext
    zNext = rLeg * rDown / (rLeg + rDown)
    z[i] = zNext
  }
}

/**
 * Turns Z (in `out`) into weights in place, starting from x0, the voltage of node 0 per unit
 * current injected there: x_{i+1} = x_i · Z_{i+1} / (R_s,i + Z_{i+1}), `out[i]` = x_i / R_leg,i.
 */
function weightsFromImpedance(
  legsOhm: ArrayLike<number>,
  seriesOhm: ArrayLike<number>,
  switchOhm: number,
  x0: number,
  out: Float64Array
): void {
  const n = legsOhm.length
  let x = x0
  for (let i = 0; i < n; i++) {
    if (i > 0) {
      const zBelow = out[i] as number
      x *= zBelow / ((seriesOhm[i - 1] as number) + zBelow)
    }
    out[i] = x / ((legsOhm[i] as number) + switchOhm)
  }
}

/**
 * Per-leg output weights of a voltage-mode ladder: `out[i]` is the output-node voltage per volt
 * applied to leg i (index 0 = MSB, at the output node), so V_out / V_REF = Σ b_i w_i exactly.
 * Ideal R-2R (2R legs, R series, 2R termination): w_i = 2^−(i+1) exactly.
 * @param legsOhm N leg resistances (ohms), index 0 at the output node
 * @param seriesOhm N−1 series resistances (ohms), index i between node i and node i+1
 * @param terminationOhm resistance from node N−1 to ground (ohms)
 * @param switchOhm on-resistance in series with every leg, either position (ohms, ≥ 0)
 * @param out optional result buffer of length ≥ N (reused to avoid allocation)
 * @returns `out` (or a new Float64Array of length N) holding the dimensionless weights
 */
export function ladderWeights(
  legsOhm: ArrayLike<number>,
  seriesOhm: ArrayLike<number>,
  terminationOhm: number,
  switchOhm = 0,
  out?: Float64Array
): Float64Array {
  const w = out ?? new Float64Array(legsOhm.length)
  impedanceTowardLsb(legsOhm, seriesOhm, terminationOhm, switchOhm, w)
  weightsFromImpedance(legsOhm, seriesOhm, switchOhm, w[0] as number, w)
  return w
}

/**
 * Thevenin resistance (ohms) at the output node (node 0) of a voltage-mode ladder; it does not
 * depend on the code because every leg ends on an ideal source. Ideal R-2R: exactly R.
 * Same parameters as {@link ladderWeights}; allocation-free.
 */
export function ladderRoutOhm(
  legsOhm: ArrayLike<number>,
  seriesOhm: ArrayLike<number>,
  terminationOhm: number,
  switchOhm = 0
): number {
  const n = legsOhm.length
  const rLast = (legsOhm[n - 1] as number) + switchOhm
  let z = rLast * terminationOhm / (rLast + terminationOhm)
  for (let i = n - 2; i >= 0; i--) {
    const rLeg = (legsOhm[i] as number) + switchOhm
    const rDown = (seriesOhm[i] as number) + z
    z = rLeg * rDown / (rLeg + rDown)
  }
  return z
}

/** Unary and binary weights of a segmented ladder, see {@link segmentedWeights}. */
export interface SegmentedWeights {
  unary: Float64Array
  binary: Float64Array
}

/**
 * Output weights of the canonical segmented DAC: 2^M − 1 unary legs on the output node, joined
 * through `jointOhm` to the MSB node of an L-bit voltage-mode ladder. With m unary legs on (legs
 * 0…m−1) and ladder bits b_i: V_out / V_REF = Σ_{j<m} unary_j + Σ b_i binary_i, exactly.
 * @param unaryLegsOhm 2^M − 1 unary leg resistances (ohms)
 * @param jointOhm series resistance from the output node to the ladder's MSB node (ohms)
 * @param legsOhm L ladder leg resistances (ohms), index 0 = ladder MSB
 * @param seriesOhm L − 1 ladder series resistances (ohms)
 * @param terminationOhm ladder termination to ground (ohms)
 * @param switchOhm on-resistance in series with every unary and ladder leg (ohms, ≥ 0)
 * @param out optional buffers to reuse (lengths 2^M − 1 and L)
 */
export function segmentedWeights(
  unaryLegsOhm: ArrayLike<number>,
  jointOhm: number,
  legsOhm: ArrayLike<number>,
  seriesOhm: ArrayLike<number>,
  terminationOhm: number,
  switchOhm = 0,
  out?: SegmentedWeights
): SegmentedWeights {
  const unary = out?.unary ?? new Float64Array(unaryLegsOhm.length)
  const binary = out?.binary ?? new Float64Array(legsOhm.length)
  impedanceTowardLsb(legsOhm, seriesOhm, terminationOhm, switchOhm, binary)
  const rLadder = binary[0] as number
  let yOut = 1 / (jointOhm + rLadder)
  for (let j = 0; j < unaryLegsOhm.length; j++) yOut += 1 / ((unaryLegsOhm[j] as number) + switchOhm)
  const xOut = 1 / yOut
  for (let j = 0; j < unaryLegsOhm.length; j++) unary[j] = xOut / ((unaryLegsOhm[j] as number) + switchOhm)
  weightsFromImpedance(legsOhm, seriesOhm, switchOhm, xOut * rLadder / (jointOhm + rLadder), binary)
  return { unary, binary }
}

/**
 * Thevenin resistance (ohms) at the output node of the segmented DAC (code independent).
 * Ideal canonical form: 2R / 2^M. Same parameters as {@link segmentedWeights}; allocation-free.
 */
export function segmentedRoutOhm(
  unaryLegsOhm: ArrayLike<number>,
  jointOhm: number,
  legsOhm: ArrayLike<number>,
  seriesOhm: ArrayLike<number>,
  terminationOhm: number,
  switchOhm = 0
): number {
  let yOut = 1 / (jointOhm + ladderRoutOhm(legsOhm, seriesOhm, terminationOhm, switchOhm))
  for (let j = 0; j < unaryLegsOhm.length; j++) yOut += 1 / ((unaryLegsOhm[j] as number) + switchOhm)
  return 1 / yOut
}
