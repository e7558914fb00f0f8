/**
 * Output dynamics (MODELS.md §6): single-pole settling of a full-scale step to ±½ LSB,
 * t_s = τ·ln(2^(N+1)) with τ = R_out,max · C_load (R_out in parallel with a resistive load), and
 * the highest update rate 1/(t_s + t_latch) [CP]. Computed through the formula registry.
 */
import { OUTPUT_FORMULAS as F } from '../explain/registry'
import type { Trace } from '../explain/types'

/** Settling factor ln(2^(N+1)) = (N + 1)·ln 2 (in units of τ). */
export function settlingFactor(bits: number): number {
  return F.settling.compute({ tau: 1, N: bits })
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
export function dynamics(routMaxOhm: number, loadCapacitanceF: number, bits: number, latchDelayS: number, trace?: Trace): { tauS: number, settlingS: number, maxUpdateRateHz: number | null } {
  const tauS = F.tau.use({ R_eff: routMaxOhm, C_L: loadCapacitanceF }, trace, 'tauS', { R_eff: 'routEffMaxOhm' })
  const settlingS = F.settling.use({ tau: tauS, N: bits }, trace, 'settlingS', { tau: 'tauS' })
  const total = settlingS + latchDelayS
  const maxUpdateRateHz = total > 0 ? F.maxUpdateRate.use({ t_s: settlingS, t_latch: latchDelayS }, trace, 'maxUpdateRateHz', { t_s: 'settlingS' }) : null
  if (trace && maxUpdateRateHz === null) {
    trace.maxUpdateRateHz = { kind: 'procedure', procedure: 'not-applicable', inputs: { settlingS, latchDelayS }, result: null }
  }
  return { tauS, settlingS, maxUpdateRateHz }
}
