/**
 * Splitting an evaluation into serialisable tasks for a worker pool. Monte Carlo trials are cut
 * into fixed chunks of MC_CHUNK_TRIALS; chunk i is seeded with deriveSeed(seed, i), so the merged
 * result is the same whatever the number of workers or the order in which chunks finish.
 */
import type { EvaluateInput } from '../contract/evaluate'
import { createSampler } from '../models/samplers'
import type { McTally } from '../stats/accumulator'
import { runMonteCarloChunk } from '../stats/montecarlo'
import type { AnalyticCandidate } from './analytic'
import { analyseCandidate } from './analytic'
import { candidateContexts } from './context'
import { sampledDnlEnvelope } from './series-mc'
import { yieldAgainstArea } from './series-yield'

/** Trials per Monte Carlo task (fixed: part of what makes a seed reproducible). */
export const MC_CHUNK_TRIALS = 250

/**
 * Chunks whose trials widen the per-code INL envelope: the first one, so the chart shows the
 * range over the first MC_CHUNK_TRIALS sampled circuits whatever the run's length. The envelope
 * pass costs about a quarter of a 16-bit trial, and more trials only add rarer extremes to a chart
 * whose yields and worst codes come from every trial anyway.
 */
export const ENVELOPE_CHUNKS = 1

/** A unit of work; carries the parsed input so it is self-contained. */
export type EvaluationTask
  = | { kind: 'analytic', input: EvaluateInput, candidateId: string }
    | { kind: 'monte-carlo', input: EvaluateInput, chunkIndex: number, trials: number }

/** The result of one task (plain data). */
export type EvaluationPart
  = | { kind: 'analytic', candidate: AnalyticCandidate }
    | { kind: 'monte-carlo', chunkIndex: number, tallies: Record<string, McTally> }

/** Tasks of an evaluation: Monte Carlo chunks first (the heavy ones), then one analytic task per candidate. */
export function planTasks(input: EvaluateInput): EvaluationTask[] {
  const tasks: EvaluationTask[] = []
  const trials = input.options.trials
  for (let i = 0; i * MC_CHUNK_TRIALS < trials; i++) {
    tasks.push({ kind: 'monte-carlo', input, chunkIndex: i, trials: Math.min(MC_CHUNK_TRIALS, trials - i * MC_CHUNK_TRIALS) })
  }
  for (const c of candidateContexts(input)) {
    tasks.push({ kind: 'analytic', input, candidateId: c.shape.id })
  }
  return tasks
}

/** Runs one task (pure, synchronous). */
export function runTask(task: EvaluationTask): EvaluationPart {
  const contexts = candidateContexts(task.input)
  if (task.kind === 'analytic') {
    const index = contexts.findIndex(x => x.shape.id === task.candidateId)
    const c = contexts[index]
    if (!c) {
      throw new Error(`unknown candidate ${task.candidateId}`)
    }
    const candidate = analyseCandidate(c, task.input)
    return { kind: 'analytic', candidate: { ...candidate, dnlEnvelope: sampledDnlEnvelope(c, index, task.input), yieldAgainstArea: yieldAgainstArea(c, task.input) } }
  }
  const { spec, options } = task.input
  const samplers = contexts.map(c => createSampler(c.shape, c.sampler))
  const tallies = runMonteCarloChunk({
    seed: options.seed,
    chunkIndex: task.chunkIndex,
    trials: task.trials,
    bits: spec.bits,
    envelopePoints: options.envelopePoints,
    envelope: task.chunkIndex < ENVELOPE_CHUNKS,
    targets: { inlTargetLsb: spec.inlTargetLsb, dnlTargetLsb: spec.dnlTargetLsb, monotonicRequired: spec.monotonicRequired }
  }, samplers)
  return { kind: 'monte-carlo', chunkIndex: task.chunkIndex, tallies: Object.fromEntries(contexts.map((c, i) => [c.shape.id, tallies[i]!])) }
}
