/**
 * The one entry point of the engine for the server and the client.
 *
 * - `parseEvaluateInput(raw)`: validate and apply defaults (zod; throws ZodError → formatIssues).
 * - `planEvaluation(input) → tasks[]`, `runEvaluationTask(task) → part`, `mergeEvaluation(input,
 *   parts) → output`: the split a worker pool uses (tasks and parts are plain serialisable data;
 *   run is pure and synchronous; merge does not depend on part order or worker count).
 * - `evaluateSpec(input)`: all of the above in-process. With `options.trials = 0` it is the
 *   analytic fast path the browser uses for live preview.
 */
import type { EvaluateInput, EvaluateOutput } from './contract/evaluate'
import { evaluateInputSchema } from './contract/evaluate'
import { mergeTally } from './stats/accumulator'
import type { McTally } from './stats/accumulator'
import type { AnalyticCandidate } from './evaluation/analytic'
import { buildCandidate } from './evaluation/candidate-output'
import { cautionsFor } from './evaluation/cautions'
import type { CandidateContext } from './evaluation/context'
import { candidateContexts } from './evaluation/context'
import type { EvaluationPart, EvaluationTask } from './evaluation/tasks'
import { planContextTasks, planTasks, runTask } from './evaluation/tasks'
import { ENGINE_VERSION } from './version'

export type { EvaluationPart, EvaluationTask } from './evaluation/tasks'
export type { CandidateContext } from './evaluation/context'
export { leanContext } from './evaluation/tasks'
export { MC_CHUNK_TRIALS } from './evaluation/tasks'
export { ENGINE_VERSION } from './version'

/** Validates a raw evaluate request and applies the defaults. @throws ZodError on bad input */
export function parseEvaluateInput(raw: unknown): EvaluateInput {
  return evaluateInputSchema.parse(raw)
}

/**
 * Splits an evaluation into independent tasks (Monte Carlo chunks first, then analytic parts).
 * A pool that first ran `planContexts` passes the contexts, so no task sizes a candidate again.
 */
export function planEvaluation(input: EvaluateInput, contexts?: readonly CandidateContext[]): EvaluationTask[] {
  return planTasks(input, contexts)
}

/** One task per candidate building its context (switch design and sampled sizing): a pool's first phase. */
export function planContexts(input: EvaluateInput): EvaluationTask[] {
  return planContextTasks(input)
}

/** Runs one task; pure and synchronous, safe to call in a worker thread. */
export function runEvaluationTask(task: EvaluationTask): EvaluationPart {
  return runTask(task)
}

function mergedTallies(parts: readonly EvaluationPart[]): Map<string, McTally> {
  const chunks = parts.flatMap(p => (p.kind === 'monte-carlo' ? [p] : [])).sort((a, b) => a.chunkIndex - b.chunkIndex)
  const out = new Map<string, McTally>()
  for (const chunk of chunks) {
    for (const [id, tally] of Object.entries(chunk.tallies)) {
      const prev = out.get(id)
      out.set(id, prev ? mergeTally(prev, tally) : tally)
    }
  }
  return out
}

/** Combines task parts into the evaluate output (candidates in a stable order, plus the recommendation). */
export function mergeEvaluation(input: EvaluateInput, parts: readonly EvaluationPart[], given?: readonly CandidateContext[]): EvaluateOutput {
  const analytic = new Map<string, AnalyticCandidate>()
  for (const p of parts) {
    if (p.kind === 'analytic') {
      analytic.set(p.candidate.id, p.candidate)
    }
  }
  const tallies = mergedTallies(parts)
  const candidates = (given ?? candidateContexts(input)).map((c) => {
    const a = analytic.get(c.shape.id)
    if (!a) {
      throw new Error(`mergeEvaluation: missing analytic part of ${c.shape.id}`)
    }
    return buildCandidate(c, a, tallies.get(c.shape.id) ?? null, input)
  })
  const passing = candidates.filter(c => c.meetsSpec).sort((a, b) => a.metrics.totalAreaMm2 - b.metrics.totalAreaMm2)
  return {
    engineVersion: ENGINE_VERSION,
    spec: input.spec,
    process: input.process,
    options: input.options,
    /** the smallest-area candidate that meets spec (kept under its contract name `recommendedId` too) */
    smallestPassingId: passing[0]?.id ?? null,
    recommendedId: passing[0]?.id ?? null,
    candidates,
    cautions: cautionsFor(input)
  }
}

/** Evaluates a parsed spec in-process: merge(plan.map(run)). */
export function evaluateSpec(input: EvaluateInput): EvaluateOutput {
  return mergeEvaluation(input, planEvaluation(input).map(runEvaluationTask))
}
