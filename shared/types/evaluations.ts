import type { EvaluateOutput } from '../core/contract/evaluate'

export type EvaluationStatus = 'queued' | 'running' | 'done' | 'failed' | 'cancelled'

/** An evaluation job: progress while it runs, the engine's output once done. */
export interface EvaluationJobDto {
  id: number
  userId: number
  status: EvaluationStatus
  progress: { done: number, total: number }
  engineVersion: string
  error: string | null
  createdAt: string
  finishedAt: string | null
  result: EvaluateOutput | null
}
