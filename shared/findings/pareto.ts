/**
 * Pareto view: area (lower is better) against a linearity margin (higher is better). A candidate
 * is dominated when another is at least as good on both and strictly better on one.
 */
import type { EvaluateCandidate, EvaluateInput } from '../core/contract/evaluate'

export const MARGIN_KINDS = ['inl', 'dnl', 'yield'] as const
export type MarginKind = typeof MARGIN_KINDS[number]

export const MARGIN_INFO: Record<MarginKind, { label: string, unit: string, explains: string }> = {
  inl: { label: 'INL margin', unit: 'LSB', explains: 'INL target − (3·σ_INL + |systematic INL|)' },
  dnl: { label: 'DNL margin', unit: 'LSB', explains: 'DNL target − (3·σ_DNL + |systematic DNL|)' },
  yield: { label: 'Yield margin', unit: 'points', explains: '(overall yield − yield target) in percentage points' }
}

export interface ParetoPoint { id: string, areaMm2: number, margin: number }
export interface ParetoEntry extends ParetoPoint { onFront: boolean, dominatedBy: string[] }

const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null)

/** The chosen linearity margin of one candidate (3σ is common practice, no source). */
export function linearityMargin(c: EvaluateCandidate, input: Pick<EvaluateInput, 'spec'>, kind: MarginKind): number {
  const m = c.metrics as Record<string, unknown>
  if (kind === 'yield') return ((num(m.yield) ?? 0) - input.spec.yieldTarget) * 100
  const sigma = num(kind === 'inl' ? m.inlSigmaLsb : m.dnlSigmaLsb) ?? Infinity
  const sys = Math.abs(num(kind === 'inl' ? m.systematicInlLsb : m.systematicDnlLsb) ?? 0)
  return (kind === 'inl' ? input.spec.inlTargetLsb : input.spec.dnlTargetLsb) - (3 * sigma + sys)
}

/** a dominates b: no worse on both, strictly better on one. */
export function dominates(a: ParetoPoint, b: ParetoPoint): boolean {
  return a.areaMm2 <= b.areaMm2 && a.margin >= b.margin && (a.areaMm2 < b.areaMm2 || a.margin > b.margin)
}

/** Ids on the Pareto front, by a sort-and-sweep (area ascending, margin descending). */
export function paretoFront(points: readonly ParetoPoint[]): Set<string> {
  const sorted = [...points].sort((a, b) => a.areaMm2 - b.areaMm2 || b.margin - a.margin)
  const front = new Set<string>()
  let best = -Infinity
  let bestArea = -Infinity
  for (const p of sorted) {
    // Same area and margin as the last front point: equal points do not dominate each other.
    if (p.margin > best || (p.margin === best && p.areaMm2 === bestArea)) {
      front.add(p.id)
      if (p.margin > best) bestArea = p.areaMm2
      best = Math.max(best, p.margin)
    }
  }
  return front
}

/** Pareto entries of an evaluation for the chosen margin. */
export function paretoView(input: Pick<EvaluateInput, 'spec'>, candidates: readonly EvaluateCandidate[], kind: MarginKind): ParetoEntry[] {
  const points: ParetoPoint[] = candidates.map(c => ({ id: c.id, areaMm2: num(c.metrics.totalAreaMm2) ?? Infinity, margin: linearityMargin(c, input, kind) }))
  const front = paretoFront(points)
  return points.map(p => ({ ...p, onFront: front.has(p.id), dominatedBy: points.filter(q => q.id !== p.id && dominates(q, p)).map(q => q.id) }))
}
