import { setMaxListeners } from 'node:events'
import { existsSync } from 'node:fs'
import { availableParallelism } from 'node:os'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { Piscina } from 'piscina'
import { leanContext, mergeEvaluation, planContexts, planEvaluation, runEvaluationTask } from '#shared/core/evaluate'
import type { CandidateContext } from '#shared/core/evaluate'
import { runInSlots } from '#shared/core/evaluation/dispatch'
import { encodeEvaluationOutput, type OutputForm } from './evaluationResult'
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
export function usePool(): Piscina | null {
  if (pool === undefined) {
    const filename = workerFile()
    const threads = Math.max(1, availableParallelism())
    // Lower priority for Monte Carlo threads, so request handling on the main thread wins the CPU.
    pool = filename ? new Piscina({ filename, minThreads: threads, maxThreads: threads, idleTimeout: 60_000, niceIncrement: 10 }) : null
    if (!pool) console.warn('[rungwise] no evaluation worker bundle found; evaluating on the request thread')
  }
  return pool
}

/** Runs one task in the pool as JSON text (or inline, as an object, when there is no pool), abortable. */
function runTask(task: Task, signal?: AbortSignal): Promise<Part | string> {
  const p = usePool()
  if (!p) return Promise.resolve(runEvaluationTask(task))
  return p.run({ kind: 'json', task }, { signal }) as Promise<string>
}

const parsePart = (part: Part | string): Part => (typeof part === 'string' ? JSON.parse(part) as Part : part)

export interface EvaluationProgress { done: number, total: number }

/** Lets timers and I/O run (a health probe, other requests) before the caller serialises the output. */
function nextTurn(): Promise<void> {
  return new Promise(resolve => setImmediate(resolve))
}

/**
 * Merge plus rule packs: tens of milliseconds for a 16-bit sweep (the rules engine most), which
 * on the request thread delayed every request arriving meanwhile, so a worker does it too.
 */
async function finish(input: EvaluateInput, parts: (Part | string)[], packs: readonly RulePack[], form: OutputForm, contexts: CandidateContext[] | undefined, signal?: AbortSignal): Promise<EvaluateOutput | string | Uint8Array> {
  const p = usePool()
  if (!p) return encodeEvaluationOutput(await applyFindings(input, mergeEvaluation(input, parts.map(parsePart), contexts), packs), form)
  const partsJson = parts.map(x => (typeof x === 'string' ? x : JSON.stringify(x)))
  const out = await p.run({ kind: 'finish', input, partsJson, packs: [...packs], as: form, contexts }, { signal }) as EvaluateOutput | string | Uint8Array
  // a Buffer comes back from the worker as a plain Uint8Array
  return form === 'gzip' ? Buffer.from((out as Uint8Array).buffer, (out as Uint8Array).byteOffset, (out as Uint8Array).byteLength) : out
}

/**
 * Evaluates a validated input with every Monte Carlo task on a worker thread, so requests keep
 * being served meanwhile. Tasks queue in the pool; `onProgress` fires after each finished task.
 * The merged output then gets findings, ranking and recommendation from the built-in rule packs
 * plus `packs` (the team's enabled ones), also on a worker thread.
 */
export async function evaluateInPool(input: EvaluateInput, options: PoolOptions = {}): Promise<EvaluateOutput> {
  return await evaluateAll(input, options, 'object') as EvaluateOutput
}

/**
 * `evaluateInPool`, answered as the output's JSON text, which a worker serialises: for callers
 * that store or send it as it is (evaluation jobs, POST /api/evaluate), so a 16-bit output of
 * megabytes is never walked on the request thread.
 */
export async function evaluateInPoolJson(input: EvaluateInput, options: PoolOptions = {}): Promise<string> {
  return await evaluateAll(input, options, 'json') as string
}

/** `evaluateInPoolJson`, gzip-compressed on the worker (what a job stores). */
export async function evaluateInPoolGzip(input: EvaluateInput, options: PoolOptions = {}): Promise<Buffer> {
  return await evaluateAll(input, options, 'gzip') as Buffer
}

interface PoolOptions { signal?: AbortSignal, onProgress?: (p: EvaluationProgress) => void | Promise<void>, packs?: readonly RulePack[] }

/**
 * First phase on the pool: every candidate's context (switch design and sampled sizing), spread
 * over the threads, so no thread sizes every candidate. Contexts cross back by structured clone
 * (typed arrays); without a pool the tasks build them in-process.
 */
async function contextsInPool(input: EvaluateInput, signal?: AbortSignal): Promise<CandidateContext[] | undefined> {
  const p = usePool()
  if (!p) return undefined
  const parts = await runInSlots(planContexts(input), p.maxThreads, task => p.run(task, { signal }) as Promise<Part>)
  return parts.map(x => (x.kind === 'context' ? x.context : null)).filter((c): c is CandidateContext => c !== null)
}

async function evaluateAll(input: EvaluateInput, options: PoolOptions, form: OutputForm): Promise<EvaluateOutput | string | Uint8Array> {
  const contexts = await contextsInPool(input, options.signal)
  const tasks = planEvaluation(input, contexts)
  // Every queued task listens on the one signal.
  if (options.signal) setMaxListeners(tasks.length + 10, options.signal)
  let done = 0
  // One task in flight per pool thread, in plan order (see runInSlots).
  const parts = await runInSlots(tasks, usePool()?.maxThreads ?? 1, async (task) => {
    const part = await runTask(task, options.signal)
    done += 1
    await options.onProgress?.({ done, total: tasks.length })
    return part
  })
  const output = await finish(input, parts, options.packs ?? [], form, contexts?.map(leanContext), options.signal)
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
