/**
 * The one place a study revision is written: the save route, reopen, import, the demo results
 * script and the large seed all build their rows here, so every revision with results carries the
 * recommendation ranked with its own weights, and the study's portfolio columns say the same.
 * Imported by relative path (scripts run outside Nitro).
 */
import type { Knex } from 'knex'
import { evaluateOutputSchema } from '../../shared/core/contract/evaluate'
import type { EvaluateInput, EvaluateOutput } from '../../shared/core/contract/evaluate'
import { DEFAULT_WEIGHTS } from '../../shared/findings/weights'
import type { RankingWeights } from '../../shared/findings/weights'
import { portfolioSummary } from '../../shared/utils/portfolio'
import { recommendResults } from '../../shared/utils/recommendation'
import type { StoredRecommendation } from '../../shared/utils/recommendation'
import { candidateLabel } from '../../utils/candidateLabel'

export interface RevisionWrite {
  studyId: number
  number: number
  inputs: Pick<EvaluateInput, 'spec' | 'process' | 'options'>
  /** results this engine computed for exactly these inputs, or null (inputs only) */
  results: EvaluateOutput | null
  /** the study's ranking weights (null: the defaults) */
  weights: RankingWeights | null
  engineVersion: string
  evaluationId?: number | null
  note: string | null
  authorId: number
  createdAt?: Date
  /** false: keep the recommendation and the study's summary but not the (large) results; the large seed only */
  storeResults?: boolean
}

/** The revision row and the study columns that go with it (version, spec, portfolio summary). */
export function revisionRecord(w: RevisionWrite): { revision: Record<string, unknown>, study: Record<string, unknown>, recommendation: StoredRecommendation | null } {
  const weights = w.weights ?? DEFAULT_WEIGHTS
  // Results of another shape (rows written before the output contract was checked) are kept as
  // they are, without a recommendation: only an engine output is ranked.
  const rankable = w.results !== null && evaluateOutputSchema.safeParse(w.results).success
  const ranked = rankable ? recommendResults(w.inputs, w.results!, weights, candidateLabel) : null
  const results = ranked?.results ?? w.results
  const summary = results ? portfolioSummary(results) : null
  const revision = {
    study_id: w.studyId, number: w.number, spec: JSON.stringify(w.inputs.spec), process: JSON.stringify(w.inputs.process), options: JSON.stringify(w.inputs.options),
    engine_version: w.engineVersion, results: results && w.storeResults !== false ? JSON.stringify(results) : null,
    recommendation: ranked ? JSON.stringify(ranked.recommendation) : null, evaluation_id: w.evaluationId ?? null,
    note: w.note, author_id: w.authorId, weights: JSON.stringify(weights), ...(w.createdAt ? { created_at: w.createdAt } : {})
  }
  const study = {
    version: w.number, spec: JSON.stringify(w.inputs.spec),
    summary_candidate_id: summary?.candidateId ?? null, summary_area_mm2: summary?.areaMm2 ?? null,
    summary_fail_count: summary?.failCount ?? null, summary_meeting_count: summary?.meetingCount ?? null,
    summary_candidate_count: summary?.candidateCount ?? null, summary_label: ranked?.recommendation.label ?? null
  }
  return { revision, study, recommendation: ranked?.recommendation ?? null }
}

/** Inserts the revision and moves the study to it, inside the caller's transaction. */
export async function writeRevision(trx: Knex.Transaction, w: RevisionWrite): Promise<StoredRecommendation | null> {
  const record = revisionRecord(w)
  await trx('study_revisions').insert(record.revision)
  await trx('studies').where({ id: w.studyId }).update({ ...record.study, updated_at: w.createdAt ?? trx.fn.now() })
  return record.recommendation
}
