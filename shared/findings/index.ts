/**
 * Findings of an evaluation: runs the rule packs, ranks the candidates and recommends one. Pure
 * and framework-free; the server applies it after the merge, the browser re-ranks with a study's
 * own weights.
 */
import type { EvaluateInput, EvaluateOutput } from '../core/contract/evaluate'
import { rankCandidates } from './ranking'
import type { RankedCandidate } from './ranking'
import { recommend } from './recommend'
import type { Recommendation } from './recommend'
import { BUILT_IN_PACKS } from './registry'
import { runFindings } from './runner'
import type { Finding } from './runner'
import type { RulePack } from './schema'
import { DEFAULT_WEIGHTS } from './weights'
import type { RankingWeights } from './weights'

export interface RankingSection {
  weights: RankingWeights
  candidates: RankedCandidate[]
}

export interface FindingsSection {
  findings: Finding[]
  ranking: RankingSection
  recommendation: Recommendation
  rulePacks: { id: string, version: number, source: RulePack['source'] }[]
}

export type EvaluateOutputWithFindings = EvaluateOutput & FindingsSection

/** Ranking and recommendation for given findings and weights (no rules run; cheap to repeat). */
export function rankEvaluation(input: EvaluateInput, output: EvaluateOutput, findings: Finding[], weights: RankingWeights = DEFAULT_WEIGHTS) {
  const candidates = rankCandidates(input, output.candidates, findings, weights)
  return { ranking: { weights, candidates }, recommendation: recommend(input, output.candidates, candidates, findings, weights) }
}

/** Runs the packs (built-in first, then the team's) and adds findings, ranking, recommendation and rulePacks. */
export async function applyFindings(input: EvaluateInput, output: EvaluateOutput, teamPacks: readonly RulePack[] = [], weights: RankingWeights = DEFAULT_WEIGHTS): Promise<EvaluateOutputWithFindings> {
  const packs = [...BUILT_IN_PACKS, ...teamPacks]
  const findings = await runFindings(input, output.candidates, packs)
  const ranked = rankEvaluation(input, output, findings, weights)
  return {
    ...output,
    // One recommendation per evaluation: the engine's smallest-area pick gives way to the ranked one.
    recommendedId: ranked.recommendation.candidateId,
    findings,
    ...ranked,
    rulePacks: packs.map(p => ({ id: p.id, version: p.version, source: p.source }))
  }
}

export type { Finding } from './runner'
export type { RankedCandidate } from './ranking'
export type { Recommendation, RunnerUp } from './recommend'
export type { RulePack, RulePackDocument, Severity } from './schema'
export type { RankingWeights } from './weights'
