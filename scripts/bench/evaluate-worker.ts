/**
 * Worker entry for the evaluation benchmark (piscina): runs one evaluation task. The bench bundles
 * it with esbuild first (as nuxt.config.ts bundles the server's worker), so no loader is needed.
 * On Linux, setpriority(0) applies to the calling thread only, so this lowers just the worker
 * thread (nice 10) and the main thread keeps answering while both cores compute.
 */
import { setPriority } from 'node:os'
import type { EvaluationPart, EvaluationTask } from '../../shared/core/evaluate'
import { runEvaluationTask } from '../../shared/core/evaluate'

try {
  setPriority(10)
} catch {
  // not permitted or not supported: run at normal priority
}

export default function run(task: EvaluationTask): EvaluationPart {
  return runEvaluationTask(task)
}
