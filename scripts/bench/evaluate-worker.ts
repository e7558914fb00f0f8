/**
 * Worker entry for the evaluation benchmark (piscina): runs one evaluation task.
 * Under tsx the pool starts workers with `execArgv: ['--import', 'tsx']`.
 */
import type { EvaluationPart, EvaluationTask } from '../../shared/core/evaluate'
import { runEvaluationTask } from '../../shared/core/evaluate'

export default function run(task: EvaluationTask): EvaluationPart {
  return runEvaluationTask(task)
}
