import type { BenchSummary, BenchQuantity } from '../io/benchCsv'
import type { BucketSeries } from '../io/benchCompare'

/** One uploaded measurement as the study lists it. */
export interface BenchMeasurementDto {
  id: number
  studyId: number
  candidateId: string
  revisionNumber: number
  fileName: string
  quantity: BenchQuantity
  bits: number
  summary: BenchSummary
  uploadedBy: { id: number, name: string }
  createdAt: string
}

/** A measurement beside its prediction: per-bucket INL of the measured and nominal curves, and the Monte Carlo envelope when the revision has one. */
export interface BenchComparisonDto extends BenchMeasurementDto {
  definition: 'endpoint' | 'best-fit'
  measured: BucketSeries
  nominal: BucketSeries
  /** the predicted nominal INL/DNL (same extraction as the measured summary) */
  predicted: BenchSummary
  envelope: BucketSeries | null
  monteCarloTrials: number | null
}
