/**
 * Worker-thread entry of the evaluation pool: runs one task of an evaluation plan off the request
 * thread. Bundled to `<server output>/workers/evaluate.mjs` at build time (see nuxt.config.ts).
 */
import { runEvaluationTask } from '../../shared/core/evaluate'

export default function run(task: Parameters<typeof runEvaluationTask>[0]) {
  return runEvaluationTask(task)
}
