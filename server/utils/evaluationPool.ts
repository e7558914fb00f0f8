import { setMaxListeners } from 'node:events'
import { existsSync } from 'node:fs'
import { availableParallelism } from 'node:os'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { Piscina } from 'piscina'
import { mergeEvaluation, planEvaluation, runEvaluationTask } from '#shared/core/evaluate'
import type { EvaluateInput, EvaluateOutput } from '#shared/core/contract/evaluate'
import type { NetlistInput } from '#shared/core/contract/netlist'
import { exportNetlist } from '#shared/core/netlist/export'
import { applyFindings } from '#shared/findings'
import type { RulePack } from '#shared/findings/schema'

type Task = ReturnType<typeof planEvaluation>[number]
type Part = ReturnType<typeof runEvaluationTask>

let pool: Piscina | null | undefined

/** Finds the bundled worker next to the server output (built) or the dev bundle; null if absent. */
function workerFile(): string | null {
  let dir = dirname(fileURLToPath(import.meta.url))
  for (let i = 0; i < 5; i++) {
    const candidate = join(dir, 'workers', 'evaluate.mjs')
    if (existsSync(candidate)) return candidate
    dir = dirname(dir)
  }
  return null
}

/**
 * The process-wide worker pool (one thread per core, all kept alive), or null where no worker
 * bundle exists. piscina's default minimum is half the cores, so after a minute idle a 2-core
 * server was down to one thread and the next evaluation waited for a cold second one (start,
 * bundle load, JIT warm-up) while its tasks queued on the first.
 */
function usePool(): Piscina | null {
  if (pool === undefined) {
    const filename = workerFile()
    const threads = Math.max(1, availableParallelism())
    // Lower priority for Monte Carlo threads, so request handling on the main thread wins the CPU.
    pool = filename ? new Piscina({ filename, minThreads: threads, maxThreads: threads, idleTimeout: 60_000, niceIncrement: 10 }) : null
    if (!pool) console.warn('[rungwise] no evaluation worker bundle found; evaluating on the request thread')
  }
  return pool
}

/** Runs one task in the pool (or inline when there is no pool), abortable. */
function runTask(task: Task, signal?: AbortSignal): Promise<Part> {
  const p = usePool()
  if (!p) return Promise.resolve(runEvaluationTask(task))
  return p.run(task, { signal }) as Promise<Part>
}

export interface EvaluationProgress { done: number, total: number }

/** Lets timers and I/O run (a health probe, other requests) before the caller serialises the output. */
function nextTurn(): Promise<void> {
  return new Promise(resolve => setImmediate(resolve))
}

/**
 * Merge plus rule packs: tens of milliseconds for a 16-bit sweep (the rules engine most), which
 * on the request thread delayed every request arriving meanwhile, so a worker does it too.
 */
async function finish(input: EvaluateInput, parts: Part[], packs: readonly RulePack[], signal?: AbortSignal): Promise<EvaluateOutput> {
  const p = usePool()
  if (!p) return await applyFindings(input, mergeEvaluation(input, parts), packs)
  return await (p.run({ kind: 'finish', input, parts, packs: [...packs] }, { signal }) as Promise<EvaluateOutput>)
}

/**
 * Evaluates a validated input with every Monte Carlo task on a worker thread, so requests keep
 * being served meanwhile. Tasks queue in the pool; `onProgress` fires after each finished task.
 * The merged output then gets findings, ranking and recommendation from the built-in rule packs
 * plus `packs` (the team's enabled ones), also on a worker thread.
 */
export async function evaluateInPool(input: EvaluateInput, options: { signal?: AbortSignal, onProgress?: (p: EvaluationProgress) => void | Promise<void>, packs?: readonly RulePack[] } = {}): Promise<EvaluateOutput> {
  const tasks = planEvaluation(input)
  // Every queued task listens on the one signal.
  if (options.signal) setMaxListeners(tasks.length + 10, options.signal)
  let done = 0
  const parts = await Promise.all(tasks.map(async (task) => {
    const part = await runTask(task, options.signal)
    done += 1
    await options.onProgress?.({ done, total: tasks.length })
    return part
  }))
  const output = await finish(input, parts, options.packs ?? [], options.signal)
  await nextTurn()
  return output
}

/** Number of tasks an input splits into (for progress reporting before the run starts). */
export function evaluationTaskCount(input: EvaluateInput): number {
  return planEvaluation(input).length
}

/**
 * The netlist contract's output as JSON text, built on a worker thread: a 16-bit string DAC is a
 * 65,536-resistor netlist of tens of MB, seconds of work that would otherwise stall every request
 * on this thread. The worker also serialises it, so only one string crosses back.
 */
export async function netlistJsonInPool(input: NetlistInput, signal?: AbortSignal): Promise<string> {
  const p = usePool()
  if (!p) return JSON.stringify(exportNetlist(input))
  return await (p.run({ kind: 'netlist', input }, { signal }) as Promise<string>)
}
