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
import type { CandidateContext } from './context'
import { candidateContext, candidateContexts } from './context'
import { candidateShapes } from '../models/shapes'
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

/**
 * A unit of work; carries the parsed input so it is self-contained. A pool first runs one
 * `context` task per candidate (switch design and sampled sizing, the costly part of a context),
 * then hands the contexts to the other tasks (`contexts`), so no thread sizes every candidate
 * again; without them a task builds (and remembers) the contexts itself.
 */
export type EvaluationTask
  = | { kind: 'context', input: EvaluateInput, candidateId: string }
    | { kind: 'analytic', input: EvaluateInput, candidateId: string, context?: CandidateContext }
    | { kind: 'monte-carlo', input: EvaluateInput, chunkIndex: number, trials: number, contexts?: CandidateContext[] }

/** The result of one task (plain data; a context holds typed arrays, so it crosses by structured clone). */
export type EvaluationPart
  = | { kind: 'context', context: CandidateContext }
    | { kind: 'analytic', candidate: AnalyticCandidate }
    | { kind: 'monte-carlo', chunkIndex: number, tallies: Record<string, McTally> }

/** One `context` task per candidate, in output order. */
export function planContextTasks(input: EvaluateInput): EvaluationTask[] {
  return candidateShapes(input.spec.bits, input.options.topologies).map(s => ({ kind: 'context', input, candidateId: s.id }))
}

/** A context without its sample arrays: what Monte Carlo tasks and the merge need. */
export function leanContext(c: CandidateContext): CandidateContext {
  return { ...c, sampled: null, bridge: null }
}

/**
 * Tasks of an evaluation: Monte Carlo chunks first (the heavy ones), then one analytic task per
 * candidate; with `contexts` (from the context tasks) every task carries what it needs.
 */
export function planTasks(input: EvaluateInput, contexts?: readonly CandidateContext[]): EvaluationTask[] {
  const tasks: EvaluationTask[] = []
  const trials = input.options.trials
  const lean = contexts?.map(leanContext)
  for (let i = 0; i * MC_CHUNK_TRIALS < trials; i++) {
    tasks.push({ kind: 'monte-carlo', input, chunkIndex: i, trials: Math.min(MC_CHUNK_TRIALS, trials - i * MC_CHUNK_TRIALS), ...(lean ? { contexts: lean } : {}) })
  }
  candidateShapes(input.spec.bits, input.options.topologies).forEach((s, i) => {
    tasks.push({ kind: 'analytic', input, candidateId: s.id, ...(contexts ? { context: contexts[i]! } : {}) })
  })
  return tasks
}

/** Runs one task (pure, synchronous). */
export function runTask(task: EvaluationTask): EvaluationPart {
  if (task.kind === 'context') {
    const shape = candidateShapes(task.input.spec.bits, task.input.options.topologies).find(s => s.id === task.candidateId)
    if (!shape) throw new Error(`unknown candidate ${task.candidateId}`)
    return { kind: 'context', context: candidateContext(shape, task.input) }
  }
  if (task.kind === 'analytic') {
    const shapes = candidateShapes(task.input.spec.bits, task.input.options.topologies)
    const index = shapes.findIndex(x => x.id === task.candidateId)
    if (index < 0) {
      throw new Error(`unknown candidate ${task.candidateId}`)
    }
    const c = task.context ?? candidateContext(shapes[index]!, task.input)
    const candidate = analyseCandidate(c, task.input)
    return { kind: 'analytic', candidate: { ...candidate, dnlEnvelope: sampledDnlEnvelope(c, index, task.input), yieldAgainstArea: yieldAgainstArea(c, task.input) } }
  }
  const contexts = task.contexts ?? candidateContexts(task.input)
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
