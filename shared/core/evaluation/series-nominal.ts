/**
 * Per-code chart series of the nominal circuit, from the exact nodal solve the analytic part
 * already made (switch resistance included): the transfer error against the ideal staircase,
 * the INL against the study's line and the DNL of every one-code step, each decimated to at most
 * `envelopePoints` buckets keeping each bucket's minimum and maximum (MODELS.md §1 definitions).
 */
import type { InlDefinition } from '../stats/linearity'
import { leastSquaresLine } from '../stats/linearity'
import type { DecimatedSeries } from '../stats/envelope'
import { decimateSeries } from '../stats/envelope'

/** The nominal per-code series of one candidate (LSB). DNL code k is the step k → k + 1. */
export interface NominalCodeSeries {
  /** V(k) − k·V_LSB (or I(k) − k·I_LSB in current mode) over the ideal LSB, offset and gain error included */
  transferErrorLsb: DecimatedSeries
  /** INL(k) against the end-point or least-squares line, in that line's LSB */
  inlLsb: DecimatedSeries
  /** DNL(k) = (V(k+1) − V(k))/LSB − 1, LSB of the same line */
  dnlLsb: DecimatedSeries
}

/** Offset a and slope s (one LSB) of the line the INL is measured against. */
export function linearityLine(levels: ArrayLike<number>, def: InlDefinition): { a: number, s: number } {
  const n = levels.length
  if (def === 'endpoint') {
    return { a: levels[0]!, s: (levels[n - 1]! - levels[0]!) / (n - 1) }
  }
  let sumV = 0
  let sumKV = 0
  for (let k = 0; k < n; k++) {
    sumV += levels[k]!
    sumKV += k * levels[k]!
  }
  return leastSquaresLine(n, sumV, sumKV)
}

/** Per-code DNL of `levels` against the step `s` (length n − 1), written into `out`. */
export function dnlPerCode(levels: ArrayLike<number>, s: number, out: Float64Array): Float64Array {
  const inv = 1 / s
  for (let k = 0; k + 1 < levels.length; k++) out[k] = (levels[k + 1]! - levels[k]!) * inv - 1
  return out
}

/**
 * Nominal series of a solved circuit. `idealLsb` is the ideal step in the unit of `levels`:
 * V_REF/2^N for a voltage output, V_REF/(R·2^N) for the current-mode ladder (MODELS.md §2).
 */
export function nominalCodeSeries(levels: Float64Array, idealLsb: number, def: InlDefinition, maxPoints: number): NominalCodeSeries {
  const n = levels.length
  const { a, s } = linearityLine(levels, def)
  const transfer = new Float64Array(n)
  const inl = new Float64Array(n)
  const invIdeal = 1 / idealLsb
  const inv = 1 / s
  for (let k = 0; k < n; k++) {
    transfer[k] = levels[k]! * invIdeal - k
    inl[k] = (levels[k]! - a) * inv - k
  }
  return {
    transferErrorLsb: decimateSeries(transfer, maxPoints),
    inlLsb: decimateSeries(inl, maxPoints),
    dnlLsb: decimateSeries(dnlPerCode(levels, s, new Float64Array(n - 1)), maxPoints)
  }
}
