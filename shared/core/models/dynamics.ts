/**
 * Output dynamics (MODELS.md §6): single-pole settling of a full-scale step to ±½ LSB,
 * t_s = τ·ln(2^(N+1)) with τ = R_out,max · C_load (R_out in parallel with a resistive load), and
 * the highest update rate 1/(t_s + t_latch) [CP].
 */

/** Settling factor ln(2^(N+1)) = (N + 1)·ln 2 (in units of τ). */
export function settlingFactor(bits: number): number {
  return (bits + 1) * Math.LN2
}

/** Largest effective output resistance (ohms) over codes, R_out ∥ R_L; infinite entries skipped. */
export function effectiveRoutMaxOhm(routOhm: ArrayLike<number>, loadResistanceOhm: number | null): number {
  let max = 0
  for (let k = 0; k < routOhm.length; k++) {
    const r = routOhm[k]!
    if (Number.isFinite(r)) {
      const eff = loadResistanceOhm === null ? r : (r * loadResistanceOhm) / (r + loadResistanceOhm)
      max = Math.max(max, eff)
    }
  }
  return max
}

/** Time constant, settling time and highest update rate of a candidate (SI units; rate null if unbounded). */
export function dynamics(routMaxOhm: number, loadCapacitanceF: number, bits: number, latchDelayS: number): { tauS: number, settlingS: number, maxUpdateRateHz: number | null } {
  const tauS = routMaxOhm * loadCapacitanceF
  const settlingS = tauS * settlingFactor(bits)
  const total = settlingS + latchDelayS
  return { tauS, settlingS, maxUpdateRateHz: total > 0 ? 1 / total : null }
}
