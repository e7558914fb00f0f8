/**
 * Dense inverse H = G⁻¹ (ohms) of the nodal matrix of a resistor chain: node k has a shunt
 * conductance s_k to AC ground (its legs, plus the termination at the far end) and a series
 * resistor r_k to node k+1. Used where the full G⁻¹ is needed (reference current as a
 * quadratic form in the bits, current-mode output resistance); N ≤ 17 nodes, so O(N²) is fine.
 *
 * Computed from the physics rather than by LU: Z_k^R / Z_k^L are the resistances seen at node k
 * toward either end (its shunt included); H_jj is the driving-point resistance at j, and the
 * column spreads by voltage dividers, H_ij = H_{i∓1,j} · Z_i / (r + Z_i). Only positive numbers
 * are added, multiplied and divided, so even a chain whose matrix is numerically singular for LU
 * (1e−6 Ω links beside 1e15 Ω legs) gives finite, accurate entries.
 */

/** Resistances toward the high-index end: zr[k] = 1 / (s_k + 1 / (r_k + zr[k+1])). */
function towardHigh(shuntS: ArrayLike<number>, seriesOhm: ArrayLike<number>): Float64Array {
  const n = shuntS.length
  const zr = new Float64Array(n)
  zr[n - 1] = 1 / (shuntS[n - 1] as number)
  for (let k = n - 2; k >= 0; k--) zr[k] = 1 / ((shuntS[k] as number) + 1 / ((seriesOhm[k] as number) + (zr[k + 1] as number)))
  return zr
}

/** Resistances toward the low-index end: zl[k] = 1 / (s_k + 1 / (r_{k−1} + zl[k−1])). */
function towardLow(shuntS: ArrayLike<number>, seriesOhm: ArrayLike<number>): Float64Array {
  const n = shuntS.length
  const zl = new Float64Array(n)
  zl[0] = 1 / (shuntS[0] as number)
  for (let k = 1; k < n; k++) zl[k] = 1 / ((shuntS[k] as number) + 1 / ((seriesOhm[k - 1] as number) + (zl[k - 1] as number)))
  return zl
}

/**
 * Returns H = G⁻¹ as a row-major n×n Float64Array (ohms).
 * @param shuntS shunt conductance of each node to AC ground (siemens), all > 0
 * @param seriesOhm n − 1 series resistances, index k between node k and k+1 (ohms)
 */
export function chainInverse(shuntS: ArrayLike<number>, seriesOhm: ArrayLike<number>): Float64Array {
  const n = shuntS.length
  const zr = towardHigh(shuntS, seriesOhm)
  const zl = towardLow(shuntS, seriesOhm)
  const h = new Float64Array(n * n)
  for (let j = 0; j < n; j++) {
    let y = shuntS[j] as number
    if (j > 0) y += 1 / ((seriesOhm[j - 1] as number) + (zl[j - 1] as number))
    if (j < n - 1) y += 1 / ((seriesOhm[j] as number) + (zr[j + 1] as number))
    h[j * n + j] = 1 / y
    for (let i = j + 1; i < n; i++) {
      const z = zr[i] as number
      h[i * n + j] = (h[(i - 1) * n + j] as number) * z / ((seriesOhm[i - 1] as number) + z)
    }
    for (let i = j - 1; i >= 0; i--) {
      const z = zl[i] as number
      h[i * n + j] = (h[(i + 1) * n + j] as number) * z / ((seriesOhm[i] as number) + z)
    }
  }
  return h
}
