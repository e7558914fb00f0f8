import type { EvaluateOptions, EvaluateOutput, EvaluateProcess, EvaluateSpec } from '../core/contract/evaluate'
import type { RankingWeights } from '../findings/weights'
import type { StoredRecommendation } from '../utils/recommendation'

/** One row of a study's History: who saved which revision, and whether it carries results. */
export interface RevisionSummaryDto {
  number: number
  engineVersion: string
  hasResults: boolean
  note: string | null
  author: { id: number, name: string }
  createdAt: string
}

/** A full, immutable revision: the inputs and the engine output saved with them (or null). */
export interface RevisionDto extends RevisionSummaryDto {
  studyId: number
  spec: EvaluateSpec
  process: EvaluateProcess
  options: EvaluateOptions
  evaluationId: number | null
  results: EvaluateOutput | null
  /** the ranking weights saved with the revision; null before weights were kept (the defaults apply) */
  weights: RankingWeights | null
  /** the one recommendation of the results, ranked with `weights` when the revision was written (null without results) */
  recommendation: StoredRecommendation | null
}

/** One changed input field between two revisions. */
export interface InputChange {
  section: 'spec' | 'process' | 'options'
  field: string
  from: unknown
  to: unknown
}

/** One changed metric of a candidate between two revisions' results. */
export interface MetricChange {
  candidate: string
  metric: string
  from: number | null
  to: number | null
}

export interface RevisionCompareDto {
  from: RevisionSummaryDto
  to: RevisionSummaryDto
  inputs: InputChange[]
  /** null unless both revisions have results */
  results: { changed: MetricChange[], onlyIn: { from: string[], to: string[] } } | null
}
