/**
 * Evaluation benchmarks (section of `npm run bench`):
 * 1. full 16-bit evaluation (all candidates, whole segmentation sweep, 2,000 trials) on a warm
 *    pool of two worker threads: plan → run tasks in the pool → merge; target < 1 s;
 * 2. the main thread's largest event-loop delay meanwhile (a 5 ms timer), a stand-in for a
 *    health endpoint that must keep answering within 50 ms;
 * 3. the in-process analytic-only 16-bit path (trials = 0, the live preview), for reference;
 * 4. that the pooled result equals the in-process one (same seed, any worker count);
 * 5. the CPU time of the same evaluation's tasks on one thread (the same esbuild bundle the
 *    workers run, after a warm-up), and the machine's load average:
 *    on a shared machine the wall time moves with other processes, the CPU time much less, and
 *    CPU time / 2 is what two idle cores would need.
 */
import { mkdtempSync, rmSync } from 'node:fs'
import { loadavg, tmpdir } from 'node:os'
import { join } from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'
import { build } from 'esbuild'
import Piscina from 'piscina'
import type { EvaluateInput, EvaluateOutput } from '../../shared/core/contract/evaluate'
import type { EvaluationPart } from '../../shared/core/evaluate'
import { evaluateSpec, leanContext, mergeEvaluation, planContexts, planEvaluation } from '../../shared/core/evaluate'
import { runInSlots } from '../../shared/core/evaluation/dispatch'
import { exampleInput } from './montecarlo'
import type { BenchRow } from './solve'

async function pooled(pool: Piscina, input: EvaluateInput): Promise<EvaluateOutput> {
  // as the server does (server/utils/evaluationPool.ts): contexts first, spread over the threads,
  // then one task per thread in flight, plan order
  const first = await runInSlots(planContexts(input), pool.maxThreads, t => pool.run(t) as Promise<EvaluationPart>)
  const contexts = first.flatMap(x => (x.kind === 'context' ? [x.context] : []))
  const parts = await runInSlots(planEvaluation(input, contexts), pool.maxThreads, t => pool.run(t) as Promise<EvaluationPart>)
  return mergeEvaluation(input, parts, contexts.map(leanContext))
}

/**
 * The 16-bit bench input of run `r`: a different INL target each time (0.5 + r·0.001 LSB), so no
 * thread finds the candidates already sized and every measured run pays for its sizing.
 */
function freshInput(trials: number, r: number): EvaluateInput {
  const input = exampleInput(16, trials)
  return { ...input, spec: { ...input.spec, inlTargetLsb: input.spec.inlTargetLsb + (r + 1) * 0.001 } }
}

async function withLagProbe<T>(work: () => Promise<T>): Promise<{ result: T, maxLagMs: number, seconds: number }> {
  let maxLagMs = 0
  let last = performance.now()
  const timer = setInterval(() => {
    const now = performance.now()
    maxLagMs = Math.max(maxLagMs, now - last - 5)
    last = now
  }, 5)
  const t0 = performance.now()
  const result = await work()
  const seconds = (performance.now() - t0) / 1000
  clearInterval(timer)
  return { result, maxLagMs, seconds }
}

/** CPU seconds of all tasks of `input` run one after another on this thread (the bundled engine). */
function cpuSeconds(engine: Engine, input: EvaluateInput): number {
  const c0 = process.cpuUsage()
  for (const task of engine.planEvaluation(input)) engine.runEvaluationTask(task)
  const c = process.cpuUsage(c0)
  return (c.user + c.system) / 1e6
}

function strip(o: EvaluateOutput): string {
  return JSON.stringify(o.candidates)
}

type Engine = Pick<typeof import('../../shared/core/evaluate'), 'planEvaluation' | 'runEvaluationTask'>

/** esbuild options shared by both bundles: one ESM file, as nuxt.config.ts builds the server's worker. */
const BUNDLE = { bundle: true, platform: 'node', format: 'esm', target: 'node20', logLevel: 'warning' } as const

/**
 * Bundles the bench worker the way nuxt.config.ts bundles the server's, so the pool runs the
 * code the server runs rather than tsx's per-module transpiled form; and the engine's plan/run
 * alone, for the single-thread CPU figure on this thread (the worker entry would renice it).
 */
async function bundles(dir: string): Promise<{ worker: string, engine: Engine }> {
  const worker = join(dir, 'evaluate-worker.mjs')
  const engine = join(dir, 'engine.mjs')
  await build({ ...BUNDLE, entryPoints: [fileURLToPath(new URL('./evaluate-worker.ts', import.meta.url))], outfile: worker })
  await build({
    ...BUNDLE, outfile: engine,
    stdin: { contents: `export { planEvaluation, runEvaluationTask } from './evaluate'`, resolveDir: fileURLToPath(new URL('../../shared/core/', import.meta.url)), loader: 'ts' }
  })
  return { worker, engine: await import(pathToFileURL(engine).href) as Engine }
}

/** Evaluation rows (see the file comment). */
export async function runEvaluateBench(): Promise<BenchRow[]> {
  const dir = mkdtempSync(join(tmpdir(), 'rungwise-bench-worker-'))
  const { worker, engine } = await bundles(dir)
  const pool = new Piscina({ filename: worker, minThreads: 2, maxThreads: 2 })
  try {
    const input = exampleInput(16, 2000)
    const load = loadavg()[0]!
    await pooled(pool, exampleInput(16, 500))
    const runs = []
    for (let r = 0; r < 3; r++) {
      runs.push(await withLagProbe(() => pooled(pool, freshInput(2000, r))))
    }
    runs.sort((a, b) => a.seconds - b.seconds)
    const best = runs[1]!
    evaluateSpec(exampleInput(16, 0))
    // the live preview after a keystroke in the INL target: a new target, the same circuits
    const t0 = performance.now()
    evaluateSpec(freshInput(0, 10))
    const previewS = (performance.now() - t0) / 1000
    // and after a keystroke that changes the circuits themselves (the unit resistor)
    const cold = exampleInput(16, 0)
    const t1 = performance.now()
    evaluateSpec({ ...cold, process: { ...cold.process, unitOhm: typeof cold.process.unitOhm === 'number' ? cold.process.unitOhm * 1.01 : 'auto' } })
    const coldS = (performance.now() - t1) / 1000
    const small = exampleInput(10, 600)
    const same = strip(await pooled(pool, small)) === strip(evaluateSpec(small))
    cpuSeconds(engine, exampleInput(16, 250)) // warm-up of this thread's copy
    const cpuS = cpuSeconds(engine, input)
    return [
      { name: 'full 16-bit evaluation, 2,000 trials, 2 worker threads (median of 3)', value: best.seconds, unit: 's', target: '< 1 s', pass: best.seconds < 1 },
      { name: 'main-thread event-loop delay during it (max)', value: Math.max(...runs.map(r => r.maxLagMs)), unit: 'ms', target: '< 50 ms', pass: runs.every(r => r.maxLagMs < 50) },
      { name: 'live preview of a 16-bit spec after a keystroke in a target (analytic, in-process)', value: previewS, unit: 's', target: '< 0.15 s', pass: previewS < 0.15 },
      { name: 'live preview of a 16-bit spec after a keystroke in the unit resistor (every candidate re-sized)', value: coldS, unit: 's', target: 'reference', pass: true },
      { name: 'pooled result identical to in-process result (10-bit, 600 trials)', value: same ? 1 : 0, unit: 'bool', target: '= 1', pass: same },
      { name: 'same full 16-bit evaluation, CPU time of its tasks on one thread (the bundled engine)', value: cpuS, unit: 's', target: 'reference (÷ 2 = two idle cores)', pass: true },
      { name: 'load average (1 min) when the section started', value: load, unit: '', target: 'reference (2 cores)', pass: true }
    ]
  } finally {
    await pool.destroy()
    rmSync(dir, { recursive: true, force: true })
  }
}
