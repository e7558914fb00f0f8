/**
 * Worker-thread entry of the evaluation pool: runs one task of an evaluation plan, or the final
 * merge plus rule packs of a whole evaluation, off the request thread. Bundled to
 * `<server output>/workers/evaluate.mjs` at build time (see nuxt.config.ts).
 * On Linux, setpriority(0) applies to the calling thread only, so this lowers just this worker
 * thread (nice 10) and the request thread wins the CPU while both cores compute; piscina's
 * `niceIncrement` alone did not do it here (its native helper is optional).
 */
import './require-shim'
import { setPriority } from 'node:os'
import type { EvaluateInput } from '../../shared/core/contract/evaluate'
import type { NetlistInput } from '../../shared/core/contract/netlist'
import { exportNetlist } from '../../shared/core/netlist/export'
import type { CandidateContext, EvaluationPart, EvaluationTask } from '../../shared/core/evaluate'
import { mergeEvaluation, runEvaluationTask } from '../../shared/core/evaluate'
import type { EvaluateOutputWithFindings } from '../../shared/findings/index'
import { applyFindings } from '../../shared/findings/index'
import type { RulePack } from '../../shared/findings/schema'
import { encodeEvaluationOutput, type OutputForm } from '../utils/evaluationResult'
import { runHeavyTask, type HeavyTask } from '../utils/heavyTasks'

try {
  setPriority(10)
} catch {
  // not permitted or not supported: run at normal priority
}

/**
 * The last step of an evaluation: merge the parts and apply the built-in and team rule packs.
 * The parts come as the JSON text the tasks returned; `as` is the form the output goes back in.
 */
export interface FinishTask {
  kind: 'finish'
  input: EvaluateInput
  partsJson: string[]
  packs: RulePack[]
  as: OutputForm
  /** the contexts the first phase built (so the merge does not size the candidates again) */
  contexts?: CandidateContext[]
}

/**
 * One evaluation task whose part comes back as JSON text: a string crosses the thread boundary as
 * one copy, where a part's nested arrays and objects cost the request thread a structured-clone
 * walk on arrival and another when they are handed to the finishing step.
 */
export interface JsonTask {
  kind: 'json'
  task: EvaluationTask
}

/** A netlist export, answered as JSON text (POST /api/netlist). */
export interface NetlistTask {
  kind: 'netlist'
  input: NetlistInput
}

/** Runs one evaluation task (pure, synchronous), the finishing step or a netlist export. */
export default async function run(task: EvaluationTask | JsonTask | FinishTask | NetlistTask | HeavyTask): Promise<EvaluationPart | string | Buffer | EvaluateOutputWithFindings | ReturnType<typeof runHeavyTask>> {
  if (task.kind === 'solve' || task.kind === 'netlist-file' || task.kind === 'nominal') return runHeavyTask(task)
  if (task.kind === 'netlist') return JSON.stringify(exportNetlist(task.input))
  if (task.kind === 'json') return JSON.stringify(runEvaluationTask(task.task))
  if (task.kind === 'finish') {
    const parts = task.partsJson.map(p => JSON.parse(p) as EvaluationPart)
    return encodeEvaluationOutput(await applyFindings(task.input, mergeEvaluation(task.input, parts, task.contexts), task.packs), task.as)
  }
  return runEvaluationTask(task)
}
