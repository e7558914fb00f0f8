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
import type { EvaluationPart, EvaluationTask } from '../../shared/core/evaluate'
import { mergeEvaluation, runEvaluationTask } from '../../shared/core/evaluate'
import type { EvaluateOutputWithFindings } from '../../shared/findings/index'
import { applyFindings } from '../../shared/findings/index'
import type { RulePack } from '../../shared/findings/schema'

try {
  setPriority(10)
} catch {
  // not permitted or not supported: run at normal priority
}

/** The last step of an evaluation: merge the parts and apply the built-in and team rule packs. */
export interface FinishTask {
  kind: 'finish'
  input: EvaluateInput
  parts: EvaluationPart[]
  packs: RulePack[]
}

/** A netlist export, answered as JSON text (POST /api/netlist). */
export interface NetlistTask {
  kind: 'netlist'
  input: NetlistInput
}

/** Runs one evaluation task (pure, synchronous), the finishing step or a netlist export. */
export default function run(task: EvaluationTask | FinishTask | NetlistTask): EvaluationPart | string | Promise<EvaluateOutputWithFindings> {
  if (task.kind === 'netlist') return JSON.stringify(exportNetlist(task.input))
  if (task.kind === 'finish') {
    return applyFindings(task.input, mergeEvaluation(task.input, task.parts), task.packs)
  }
  return runEvaluationTask(task)
}
