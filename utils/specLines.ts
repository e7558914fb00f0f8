import type { EvaluateCandidate } from '#shared/core/contract/evaluate'
import { FORMATS } from '#shared/findings/format'
import { formatNumber } from '#shared/utils/format'
import { formatMetric } from '#shared/utils/metricFormat'

/** How a candidate stands on one spec line. */
export type LineState = 'pass' | 'risk' | 'fail' | 'note' | 'unsettled'

/** Headroom below which a met spec line is shown as a risk (common practice, no source). */
export const RISK_HEADROOM = 0.1

export const LINE_LOOK: Record<LineState, { shape: string, word: string, text: string }> = {
  pass: { shape: '✓', word: 'meets', text: 'text-pass' },
  risk: { shape: '▲', word: 'risk', text: 'text-risk-ink' },
  fail: { shape: '✕', word: 'fails', text: 'text-fail' },
  note: { shape: '•', word: 'note', text: 'text-slate' },
  // a Monte Carlo yield whose confidence interval contains the target: neither met nor failed yet
  unsettled: { shape: '?', word: 'not settled yet', text: 'text-risk-ink' }
}

type Spec = Record<string, unknown>
type Metrics = Record<string, unknown>

interface LineDef {
  /** the engine's name in `candidate.failing` */
  id: string
  label: string
  metric: string
  /** 'max': the value must stay at or below the limit; 'min': at or above */
  sense: 'max' | 'min'
  limit: (spec: Spec) => number | null
  limitWord: string
}

const n = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null)

/** The spec lines a candidate is checked against, in table order. */
export const SPEC_LINES: readonly LineDef[] = [
  { id: 'area', label: 'Area', metric: 'totalAreaMm2', sense: 'max', limit: s => n(s.areaBudgetMm2), limitWord: 'budget' },
  { id: 'yield', label: 'Yield', metric: 'yield', sense: 'min', limit: s => n(s.yieldTarget), limitWord: 'target' },
  { id: 'update-rate', label: 'Update rate', metric: 'maxUpdateRateHz', sense: 'min', limit: s => n(s.updateRateHz), limitWord: 'required' },
  { id: 'glitch', label: 'Worst glitch', metric: 'glitchWorstVs', sense: 'max', limit: s => n(s.glitchLimitVs), limitWord: 'limit' },
  { id: 'power', label: 'Reference power', metric: 'refPowerMaxW', sense: 'max', limit: s => n(s.powerBudgetW), limitWord: 'budget' }
]

export interface LineResult { id: string, label: string, value: string, limit: string, margin: number | null, marginText: string, state: LineState }

/**
 * Margin of a value against its limit, as a share of the limit (positive = inside the spec). Yield
 * is judged on what is lost: (allowed loss − loss) / allowed loss.
 */
export function lineMargin(def: Pick<LineDef, 'metric' | 'sense'>, value: number | null, limit: number | null): number | null {
  if (value === null || limit === null) return null
  if (def.metric === 'yield') return limit >= 1 ? null : ((1 - limit) - (1 - value)) / (1 - limit)
  if (limit === 0) return null
  return def.sense === 'max' ? (limit - value) / limit : (value - limit) / limit
}

/** "+23 %" near the limit; "×40 inside" or "×3 over" when the value is far from it. */
function marginText(def: Pick<LineDef, 'metric' | 'sense'>, value: number, limit: number, margin: number | null): string {
  if (margin === null) return '—'
  const [v, l] = def.metric === 'yield' ? [1 - value, 1 - limit] : [value, limit]
  const inside = def.sense === 'max' || def.metric === 'yield' ? l / v : v / l
  if (inside >= 2) return inside > 1e3 ? '×1000+ inside' : `×${formatNumber(inside, 2)} inside`
  if (inside <= 0.5) return `×${formatNumber(1 / inside, 2)} over`
  return `${margin >= 0 ? '+' : '−'}${Math.abs(Math.round(margin * 100))} %`
}

const fmt = (metric: string, v: number) => (metric === 'yield' ? FORMATS.yield!(v) : formatMetric(metric, v))

/** Yield items (`yield`, `monotonic`) whose Monte Carlo interval contains the target (the engine's `unsettled`). */
export function unsettledItems(c: EvaluateCandidate): string[] {
  const list = (c as { unsettled?: unknown }).unsettled
  return Array.isArray(list) ? list.filter((x): x is string => typeof x === 'string') : []
}

/** Every spec line of a candidate: its value, the limit, the margin and the state (fail follows the engine). */
export function specLines(c: EvaluateCandidate, spec: Spec): LineResult[] {
  const m = c.metrics as Metrics
  return SPEC_LINES.map((def) => {
    const value = n(m[def.metric])
    const limit = def.limit(spec)
    const margin = lineMargin(def, value, limit)
    const failed = c.failing.includes(def.id) || (def.id === 'yield' && c.failing.includes('monotonic'))
    const unsettled = def.id === 'yield' && unsettledItems(c).length > 0
    const state: LineState = failed ? 'fail' : unsettled ? 'unsettled' : value === null ? 'note' : margin !== null && margin < RISK_HEADROOM ? 'risk' : 'pass'
    const text = unsettled ? 'interval holds target' : value === null || limit === null ? 'not limited' : marginText(def, value, limit, margin)
    return { id: def.id, label: def.label, value: value === null ? 'n/a' : fmt(def.metric, value), limit: limit === null ? '—' : `${def.limitWord} ${fmt(def.metric, limit)}`, margin, marginText: text, state }
  })
}
