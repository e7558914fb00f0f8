import type { EvaluateCandidate } from '#shared/core/contract/evaluate'
import type { CodeSeries } from './chartSeries'

/** The nominal per-code series of a candidate (evaluate output: linearity.perCode), LSB. */
export interface PerCodeSeries { transferErrorLsb: CodeSeries, inlLsb: CodeSeries, dnlLsb: CodeSeries }

/** The Monte Carlo DNL envelope of a candidate (linearity.dnlEnvelope), LSB. */
export interface DnlEnvelopeSeries { samples: number, seed: number, codes: number[], dnlMinLsb: number[], dnlMaxLsb: number[] }

/** The nominal per-code series, or null for an output from before the engine wrote them. */
export function perCodeOf(c: EvaluateCandidate): PerCodeSeries | null {
  return (c.linearity as { perCode?: PerCodeSeries }).perCode ?? null
}

/** The Monte Carlo DNL envelope, or null without a run. */
export function dnlEnvelopeOf(c: EvaluateCandidate): DnlEnvelopeSeries | null {
  return (c.linearity as { dnlEnvelope?: DnlEnvelopeSeries | null }).dnlEnvelope ?? null
}

/** A min/max series as apex rangeArea points. */
export function rangePoints(s: CodeSeries): { x: number, y: [number | null, number | null] }[] {
  return s.codes.map((x, i) => ({ x, y: [s.min[i] ?? null, s.max[i] ?? null] }))
}
