/**
 * The one recommendation of saved results: ranked on the server with the study's weights when a
 * revision is written, stored with it, and read from there by every view (study, portfolio,
 * brief, comparison CSV, API). Also the one definition of what a candidate fails (spec lines and
 * team rules), which waivers and the failing-findings counts use.
 */
import type { EvaluateCandidate, EvaluateInput, EvaluateOutput } from '../core/contract/evaluate'
import { rankEvaluation } from '../findings/index'
import type { Finding, Recommendation } from '../findings/index'
import { BUILT_IN_PACKS } from '../findings/registry'
import { DEFAULT_WEIGHTS } from '../findings/weights'
import type { RankingWeights } from '../findings/weights'

/** What a revision stores: the recommendation, the weights it was ranked with and the candidate's name. */
export interface StoredRecommendation extends Recommendation {
  weights: RankingWeights
  /** the recommended candidate in words (null when none meets spec) */
  label: string | null
}

type Inputs = Pick<EvaluateInput, 'spec' | 'process' | 'options'>
type Labeller = (c: EvaluateCandidate) => string

/**
 * Ranks results with the study's weights and writes that ranking into them (`ranking`,
 * `recommendation`, and `recommendedId`, the contract's field, now the ranked pick; the engine's
 * area-only pick stays in `smallestPassingId`). No rules run: the findings are the evaluation's.
 */
export function recommendResults(inputs: Inputs, results: EvaluateOutput, weights: RankingWeights | null, label: Labeller): { results: EvaluateOutput, recommendation: StoredRecommendation } {
  const w = weights ?? DEFAULT_WEIGHTS
  const findings = ((results as { findings?: Finding[] }).findings) ?? []
  const ranked = rankEvaluation(inputs as EvaluateInput, results, findings, w)
  const rec = ranked.recommendation
  const c = rec.candidateId === null ? undefined : results.candidates.find(x => x.id === rec.candidateId)
  return {
    results: { ...results, findings, ...ranked, recommendedId: rec.candidateId } as EvaluateOutput,
    recommendation: { ...rec, weights: w, label: c ? label(c) : null }
  }
}

/** One spec line or team rule a candidate fails: the key a waiver names, and its words. */
export interface FailingLine { key: string, label: string }

const LINE_WORDS: Record<string, string> = {
  'area': 'Area over budget', 'yield': 'Yield below target', 'monotonic': 'Monotonic yield below target',
  'update-rate': 'Update rate below the required one', 'glitch': 'Worst glitch over the limit',
  'power': 'Reference power over budget', 'reference': 'Reference source needs a buffer'
}

interface ResultsLike {
  candidates?: { id: string, failing?: string[] }[]
  findings?: { candidateId: string, severity: string, packId?: string, ruleId?: string, title?: string }[]
}

/**
 * What a candidate fails: the engine's spec lines (`failing`) and the `fail` findings of team rule
 * packs (the built-in pack's fail rules restate the spec lines, so they are not counted twice).
 */
export function failingLines(results: ResultsLike | null, candidateId: string): FailingLine[] {
  const c = results?.candidates?.find(x => x.id === candidateId)
  if (!c) return []
  const builtIn = new Set(BUILT_IN_PACKS.map(p => p.id))
  const lines = (c.failing ?? []).map(key => ({ key, label: LINE_WORDS[key] ?? key }))
  const team = (results?.findings ?? []).filter(f => f.candidateId === candidateId && f.severity === 'fail' && f.packId && !builtIn.has(f.packId))
  return [...lines, ...team.map(f => ({ key: `${f.packId}/${f.ruleId}`, label: f.title ?? `${f.packId}/${f.ruleId}` }))]
}

/**
 * The failing findings the portfolio and the brief count: those of the chosen candidate, else of
 * the recommended one, else (nothing chosen and none meets spec) of every candidate.
 */
export function subjectFailFindings<T extends { candidateId: string, severity: string }>(findings: readonly T[] | undefined, subjectId: string | null): T[] {
  return (findings ?? []).filter(f => f.severity === 'fail' && (subjectId === null || f.candidateId === subjectId))
}
