/**
 * Ranks candidates: those with a `fail` finding do not meet spec; the rest get a weighted score
 * from 0 to 100 over area, yield margin, glitch, reference load, settling margin, power and
 * complexity. Each criterion is scaled between the best (0) and worst (1) candidate that meets
 * spec, on a log scale for quantities spanning decades; score = 100 · (1 − Σ w·badness / Σ w).
 */
import type { EvaluateCandidate, EvaluateInput } from '../core/contract/evaluate'
import type { Finding } from './runner'
import { CRITERIA } from './weights'
import type { Criterion, RankingWeights } from './weights'

export interface RankedCandidate {
  candidateId: string
  meetsSpec: boolean
  /** 1 = best; null for a candidate that fails spec */
  rank: number | null
  /** 0–100, higher is better; null when it fails spec */
  score: number | null
  /** 0 = best of those meeting spec, 1 = worst, per criterion */
  badness: Partial<Record<Criterion, number>>
  /** the value each criterion was judged on (lower is better except the margins) */
  values: Record<Criterion, number>
  failIds: string[]
}

const num = (v: unknown, fallback: number) => (typeof v === 'number' && Number.isFinite(v) ? v : fallback)
const log = (v: number) => Math.log10(Math.max(v, 1e-300))

/** The value of each criterion, oriented so that lower is better. */
export function criterionValues(c: EvaluateCandidate, input: EvaluateInput): Record<Criterion, number> {
  const m = c.metrics as Record<string, unknown>
  const lostPpm = Math.max(0, 1 - num(m.yield, 0)) * 1e6
  const rate = num(m.maxUpdateRateHz, 0) / input.spec.updateRateHz
  return {
    area: log(num(m.totalAreaMm2, Infinity)),
    yieldMargin: lostPpm,
    glitch: log(num(m.glitchWorstVs, 0) || 1e-30),
    referenceLoad: log(num(m.irefMaxA, 0) || 1e-30),
    settlingMargin: -log(rate || 1e-30),
    power: log(num(m.refPowerMaxW, 0) || 1e-30),
    complexity: log(1 + num(m.switchCount, 0) + num(m.decoderGateCount, 0) + 10 * num(m.bufferCount, 0))
  }
}

function scale(values: number[]): (v: number) => number {
  const lo = Math.min(...values)
  const hi = Math.max(...values)
  return v => (hi - lo > 1e-12 ? (v - lo) / (hi - lo) : 0)
}

/** Weighted score (0–100) from per-criterion badness. */
export function weightedScore(badness: Partial<Record<Criterion, number>>, weights: RankingWeights): number {
  const total = CRITERIA.reduce((s, c) => s + weights[c], 0)
  const sum = CRITERIA.reduce((s, c) => s + weights[c] * (badness[c] ?? 0), 0)
  return total > 0 ? 100 * (1 - sum / total) : 0
}

/** Ranks every candidate (meeting spec first, by score; failing ones after, fewest failures first). */
export function rankCandidates(input: EvaluateInput, candidates: readonly EvaluateCandidate[], findings: readonly Finding[], weights: RankingWeights): RankedCandidate[] {
  const fails = (id: string) => findings.filter(f => f.candidateId === id && f.severity === 'fail').map(f => f.ruleId)
  const rows = candidates.map(c => ({ c, values: criterionValues(c, input), failIds: fails(c.id) }))
  const meeting = rows.filter(r => r.failIds.length === 0)
  const scalers = Object.fromEntries(CRITERIA.map(k => [k, scale(meeting.map(r => r.values[k]))])) as Record<Criterion, (v: number) => number>
  const ranked: RankedCandidate[] = rows.map(({ c, values, failIds }) => {
    const ok = failIds.length === 0
    const badness = ok ? Object.fromEntries(CRITERIA.map(k => [k, scalers[k](values[k])])) : {}
    return { candidateId: c.id, meetsSpec: ok, rank: null, score: ok ? weightedScore(badness, weights) : null, badness, values, failIds }
  })
  ranked.sort((a, b) => (a.meetsSpec === b.meetsSpec ? 0 : a.meetsSpec ? -1 : 1)
    || (b.score ?? 0) - (a.score ?? 0)
    || a.failIds.length - b.failIds.length
    || a.values.area - b.values.area
    || a.candidateId.localeCompare(b.candidateId))
  let next = 1
  for (const r of ranked) if (r.meetsSpec) r.rank = next++
  return ranked
}
