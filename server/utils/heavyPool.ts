import type { H3Event } from 'h3'
import type { NetlistInput, NetlistSpecInput } from '#shared/core/contract/netlist'
import type { SolveInput } from '#shared/core/contract/solve'
import { runHeavyTask, type HeavyTask, type NetlistFile } from './heavyTasks'

function runInPool<T>(task: HeavyTask, signal?: AbortSignal): Promise<T> {
  const p = usePool()
  if (!p) return Promise.resolve(runHeavyTask(task) as T)
  return p.run(task, { signal }) as Promise<T>
}

/** Aborted when the client goes away before the answer is sent (its queued work is dropped). */
export function clientGone(event: H3Event): AbortSignal {
  const controller = new AbortController()
  event.node.res.once('close', () => {
    if (!event.node.res.writableFinished) controller.abort()
  })
  return controller.signal
}

/** The exact solve's output (fixed contract) as JSON text, computed and serialised on a worker. */
export function solveJsonInPool(input: SolveInput, signal?: AbortSignal): Promise<string> {
  return runInPool({ kind: 'solve', input }, signal)
}

/** A netlist's text, or only its size when above `maxBytes` (the worker keeps the text). */
export function netlistFileInPool(input: NetlistInput, maxBytes: number, signal?: AbortSignal): Promise<NetlistFile> {
  return runInPool({ kind: 'netlist-file', input, maxBytes }, signal)
}

/** A candidate's nominal level per code (exact solve, switch resistance included). */
export async function nominalLevelsInPool(input: NetlistSpecInput, signal?: AbortSignal): Promise<number[]> {
  return Array.from(await runInPool<Float64Array>({ kind: 'nominal', input }, signal))
}
