/**
 * The recommendation: the best-ranked candidate that meets spec, the reasons (its margins, where
 * it leads, its top findings), and the runner-up with what it would take to switch to it.
 */
import type { EvaluateCandidate, EvaluateInput } from '../core/contract/evaluate'
import { FORMATS } from './format'
import type { RankedCandidate } from './ranking'
import type { Finding } from './runner'
import { SEVERITY_ORDER } from './runner'
import { CRITERIA, CRITERION_INFO, MAX_WEIGHT } from './weights'
import type { RankingWeights } from './weights'

export interface RunnerUp {
  candidateId: string
  meetsSpec: boolean
  /** score points behind the recommendation (null when it fails spec) */
  scoreGap: number | null
  /** where it is better than the recommendation */
  strengths: string[]
  /** what it would take to choose it instead */
  toSwitch: string[]
}

export interface Recommendation {
  candidateId: string | null
  score: number | null
  reasons: string[]
  runnerUp: RunnerUp | null
}

const f = (name: string, v: unknown) => FORMATS[name]!(v)

function marginReasons(c: EvaluateCandidate, input: EvaluateInput): string[] {
  const m = c.metrics as Record<string, unknown>
  const s = input.spec
  const share = (m.totalAreaMm2 as number) / s.areaBudgetMm2
  return [
    `Area ${f('mm2', m.totalAreaMm2)}, ${f('pct', share)} of the ${f('mm2', s.areaBudgetMm2)} budget`,
    `Yield ${f('yield', m.yield)} against a ${f('yield', s.yieldTarget)} target`,
    `Worst glitch ${f('vs', m.glitchWorstVs)} against a ${f('vs', s.glitchLimitVs)} limit`,
    `Updates up to ${f('hz', m.maxUpdateRateHz)} (${f('hz', s.updateRateHz)} required)`
  ]
}

function leads(r: RankedCandidate, weights: RankingWeights): string[] {
  return CRITERIA.filter(k => weights[k] > 0 && r.badness[k] === 0).map(k => CRITERION_INFO[k].label.toLowerCase())
}

function topFindings(findings: readonly Finding[], id: string, n = 3): string[] {
  return findings.filter(x => x.candidateId === id && x.severity !== 'note')
    .sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity]).slice(0, n).map(x => `${x.title}: ${x.explanation}`)
}

/** Weight changes (one criterion at a time, within 0–10) that would put `run` ahead of `rec`. */
export function weightChangesToSwitch(rec: RankedCandidate, run: RankedCandidate, weights: RankingWeights): string[] {
  const gap = CRITERIA.reduce((s, k) => s + weights[k] * ((run.badness[k] ?? 0) - (rec.badness[k] ?? 0)), 0)
  const out: string[] = []
  for (const k of CRITERIA) {
    const d = (rec.badness[k] ?? 0) - (run.badness[k] ?? 0)
    if (d <= 1e-12) continue
    const needed = weights[k] + gap / d
    if (needed <= MAX_WEIGHT) out.push(`raise the ${CRITERION_INFO[k].label.toLowerCase()} weight from ${weights[k]} to above ${Number(needed.toPrecision(3))}`)
  }
  return out
}

function runnerUpOf(ranked: RankedCandidate[], rec: RankedCandidate | undefined, findings: readonly Finding[], weights: RankingWeights): RunnerUp | null {
  const run = ranked.find(r => r !== rec)
  if (!run) return null
  const fails = findings.filter(x => x.candidateId === run.candidateId && x.severity === 'fail')
  if (!run.meetsSpec || !rec) {
    return { candidateId: run.candidateId, meetsSpec: false, scoreGap: null, strengths: [], toSwitch: fails.map(x => `${x.title}: ${x.action}`) }
  }
  const strengths = CRITERIA.filter(k => weights[k] > 0 && (run.badness[k] ?? 0) < (rec.badness[k] ?? 0)).map(k => `better ${CRITERION_INFO[k].label.toLowerCase()}`)
  const changes = weightChangesToSwitch(rec, run, weights)
  const toSwitch = changes.length ? changes : [`no single weight change within 0–${MAX_WEIGHT} puts it ahead; it trails on the weighted criteria as a whole`]
  return { candidateId: run.candidateId, meetsSpec: true, scoreGap: (rec.score ?? 0) - (run.score ?? 0), strengths, toSwitch }
}

/** Builds the recommendation from the ranking. */
export function recommend(input: EvaluateInput, candidates: readonly EvaluateCandidate[], ranked: RankedCandidate[], findings: readonly Finding[], weights: RankingWeights): Recommendation {
  const rec = ranked.find(r => r.meetsSpec)
  const runnerUp = runnerUpOf(ranked, rec, findings, weights)
  if (!rec) {
    const reasons = ['No candidate meets every hard spec item; the closest is listed as the runner-up with what it fails.']
    return { candidateId: null, score: null, reasons, runnerUp }
  }
  const c = candidates.find(x => x.id === rec.candidateId)!
  const lead = leads(rec, weights)
  const reasons = [
    `Meets every hard spec item, with the best weighted score (${Number(rec.score!.toFixed(1))} of 100)${lead.length ? `; best of those meeting spec on ${lead.join(', ')}` : ''}`,
    ...marginReasons(c, input),
    ...topFindings(findings, c.id)
  ]
  return { candidateId: rec.candidateId, score: rec.score, reasons, runnerUp }
}
