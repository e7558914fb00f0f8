/**
 * Worker-thread entry of the evaluation pool: runs one task of an evaluation plan off the request
 * thread. Bundled to `<server output>/workers/evaluate.mjs` at build time (see nuxt.config.ts).
 * On Linux, setpriority(0) applies to the calling thread only, so this lowers just this worker
 * thread (nice 10) and the request thread wins the CPU while both cores compute; piscina's
 * `niceIncrement` alone did not do it here (its native helper is optional).
 */
import { setPriority } from 'node:os'
import type { EvaluationPart, EvaluationTask } from '../../shared/core/evaluate'
import { runEvaluationTask } from '../../shared/core/evaluate'

try {
  setPriority(10)
} catch {
  // not permitted or not supported: run at normal priority
}

/** Runs one evaluation task (pure, synchronous) and returns its part. */
export default function run(task: EvaluationTask): EvaluationPart {
  return runEvaluationTask(task)
}
