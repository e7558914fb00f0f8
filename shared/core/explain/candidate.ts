/**
 * Explanations of one candidate: the analytic part is re-run with a trace (the same code path,
 * so the same numbers), and the metric-level entries the evaluation assembles (yields and their
 * source) are added from the evaluated candidate's Monte Carlo section.
 */
import type { EvaluateInput } from '../contract/evaluate'
import { analyseCandidate } from '../evaluation/analytic'
import type { CandidateContext } from '../evaluation/context'
import { candidateContext } from '../evaluation/context'
import { candidateShapes } from '../models/shapes'
import { sizeUnit } from '../models/sizing'
import type { MonteCarloFacts, Trace } from './types'

/** Per-yield Monte Carlo estimates as the evaluate output carries them (linearity.monteCarlo). */
interface Estimate { passes: number, trials: number, yield: number, low: number, high: number, confidence: number }

const isEstimate = (x: unknown): x is Estimate => typeof x === 'object' && x !== null && typeof (x as Estimate).passes === 'number' && typeof (x as Estimate).low === 'number'

/** The Monte Carlo estimates of an evaluated candidate, or null when no trials ran. */
export function monteCarloOf(candidate: unknown): Record<'inl' | 'dnl' | 'monotonic' | 'all', Estimate> | null {
  const mc = (candidate as { linearity?: { monteCarlo?: Record<string, unknown> | null } } | null)?.linearity?.monteCarlo
  if (!mc) {
    return null
  }
  const { inl, dnl, monotonic, all } = mc
  return isEstimate(inl) && isEstimate(dnl) && isEstimate(monotonic) && isEstimate(all) ? { inl, dnl, monotonic, all } : null
}

function facts(e: Estimate, seed: number): MonteCarloFacts {
  return { trials: e.trials, passes: e.passes, seed, confidence: e.confidence, low: e.low, high: e.high }
}

function traceYields(input: EvaluateInput, mc: ReturnType<typeof monteCarloOf>, trace: Trace): void {
  const seed = input.options.seed
  if (mc) {
    const sampled = (key: string, e: Estimate, result: number) => {
      trace[key] = { kind: 'procedure', procedure: 'monte-carlo-yield', inputs: { passes: e.passes, trials: e.trials }, result, monteCarlo: facts(e, seed) }
    }
    sampled('inlYield', mc.inl, mc.inl.passes / mc.inl.trials)
    sampled('dnlYield', mc.dnl, mc.dnl.passes / mc.dnl.trials)
    sampled('monotonicYield', mc.monotonic, mc.monotonic.passes / mc.monotonic.trials)
    sampled('yield', mc.all, mc.all.yield)
    sampled('yieldLow', mc.all, mc.all.low)
    sampled('yieldHigh', mc.all, mc.all.high)
    trace.yieldSource = { kind: 'procedure', procedure: 'monte-carlo-yield', inputs: { trials: mc.all.trials }, result: 'monte-carlo' }
    return
  }
  trace.inlYield = trace.inlYieldAnalytic!
  trace.dnlYield = trace.dnlYieldAnalytic!
  trace.monotonicYield = trace.monotonicYieldAnalytic!
  // every criterion together on the sizing sample (set by traceFast)
  trace.yield = trace.yieldAnalytic!
  trace.yieldLow = { kind: 'procedure', procedure: 'not-applicable', inputs: { trials: 0 }, result: null }
  trace.yieldHigh = { kind: 'procedure', procedure: 'not-applicable', inputs: { trials: 0 }, result: null }
  trace.yieldSource = { kind: 'procedure', procedure: 'analytic-yield', inputs: { trials: 0 }, result: 'analytic' }
}

/** Entries of the fast-yield and switch-design facts a candidate reports. */
function traceFast(c: CandidateContext, trace: Trace): void {
  const procedure = c.fast.model === 'closed-form' ? 'closed-form-yield' : c.fast.model === 'sampled' ? 'sampled-yield' : 'bridge-sample-yield'
  const inputs = { trials: c.fast.trials, sigmaUnit: c.sizing.sigmaUnit }
  trace.yieldAnalytic = { kind: 'procedure', procedure, inputs: { ...inputs, criterion: 'all' }, result: c.fast.yields.yield }
  trace.fastYieldModel = { kind: 'procedure', procedure, inputs, result: c.fast.model }
  trace.fastYieldTrials = { kind: 'procedure', procedure, inputs, result: c.fast.trials }
  trace.sizingFeasible = { kind: 'procedure', procedure: c.fast.model === 'closed-form' ? 'closed-form-yield' : 'sampled-sizing', inputs, result: c.fast.feasible }
  const d = c.design?.chosen
  const design = { kind: 'procedure' as const, procedure: d ? 'switch-design' : 'not-applicable', inputs: { choice: c.design?.choice ?? null } }
  trace.switchHandling = { ...design, result: d?.handling ?? null }
  trace.switchScale = { ...design, result: d?.scale ?? null }
}

/**
 * How every metric of one candidate was computed, keyed by metric name (plus the intermediate
 * steps the metrics refer to through `from`).
 * @param candidate the evaluated candidate (its id and, when trials ran, linearity.monteCarlo)
 * @throws Error when the input has no candidate of that id
 */
export function explainCandidate(input: EvaluateInput, candidate: { id: string }): Trace {
  // only this candidate's context: building every context would size the whole sweep (the page calls this on its own thread)
  const shape = candidateShapes(input.spec.bits, input.options.topologies).find(x => x.id === candidate.id)
  if (!shape) {
    throw new Error(`explainCandidate: no candidate ${candidate.id} in this input`)
  }
  const c = candidateContext(shape, input)
  const trace: Trace = {}
  sizeUnit(c.shape, c.sizingSpec, input.process, trace, c.sizingGiven)
  if (!trace.unitOhmChoice) {
    trace.unitOhmChoice = { kind: 'procedure', procedure: 'given', inputs: { unitOhm: c.sizing.unitOhm }, result: c.sizing.unitOhmChoice }
  }
  analyseCandidate(c, input, trace)
  traceFast(c, trace)
  traceYields(input, monteCarloOf(candidate), trace)
  return trace
}
