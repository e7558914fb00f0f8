/**
 * Fast yields and sizing of the candidates too large to size on a sample of their own (strings
 * above 11 bits, segmented DACs with more than 2^11 unary legs). Their INL is a Brownian bridge
 * over the unary array (MODELS.md §4.2, §4.5): max|INL| = a·σ_u·U, where the law of U does not
 * depend on the array's length (up to a continuity correction of about β/√n). U is read from the
 * sizing sample of an 11-bit string with the same INL definition (so best-fit lines are handled,
 * which the Kolmogorov bound is not), scaled by the candidate's own a. DNL and monotonicity use
 * the closed forms. Targets are reduced by the nominal error at the worst switch corner.
 */
import type { EvaluateInput } from '../contract/evaluate'
import { analyticDnlYield, analyticInlYield, analyticMonotonicYield, inlModel } from '../models/matching'
import { createSampler } from '../models/samplers'
import type { CandidateShape } from '../models/shapes'
import type { SampledSigmas, UnitSizing } from '../models/sizing'
import { sizeUnit } from '../models/sizing'
import type { CandidateDesign } from './design'
import type { FastYields } from './sampled-sizing'
import { sampleSizing, sigmaForYield, sizingTrials, yieldAt } from './sampled-sizing'

/** Targets left once the nominal error is taken off (never below 1e-6 of the target). */
function leftOver(target: number, nominal: number): number {
  return Math.max(target - nominal, 1e-6 * target)
}

/** Targets and margins a closed form reads for a candidate with this design. */
function closedTargets(input: EvaluateInput, design: CandidateDesign | null) {
  const { spec } = input
  const nInl = design?.chosen.systematicInlLsb ?? 0
  const nDnl = design?.chosen.systematicDnlLsb ?? 0
  const monoGap = 1 + Math.min(0, design?.chosen.systematicDnlMinLsb ?? 0)
  const feasible = nInl < spec.inlTargetLsb && nDnl < spec.dnlTargetLsb && monoGap > 0
  return { feasible, monoGap, spec: { ...spec, inlTargetLsb: leftOver(spec.inlTargetLsb, nInl), dnlTargetLsb: leftOver(spec.dnlTargetLsb, nDnl) } }
}

/** The closed-form fast yields of a candidate at a unit σ. */
export function closedFormAt(s: CandidateShape, input: EvaluateInput, design: CandidateDesign | null, sigmaUnit: number): FastYields {
  const { feasible, monoGap, spec: t } = closedTargets(input, design)
  const twoR = input.process.twoRConstruction
  const inlYield = feasible ? analyticInlYield(s, twoR, sigmaUnit, t.inlTargetLsb) : 0
  const dnlYield = feasible ? analyticDnlYield(s, twoR, sigmaUnit, t.dnlTargetLsb) : 0
  // the monotonic margin shrinks with a negative nominal step: scale σ up by 1/gap
  const monotonicYield = monoGap > 0 ? analyticMonotonicYield(s, twoR, sigmaUnit / monoGap) : 0
  return { inlYield, dnlYield, monotonicYield, yield: inlYield * dnlYield * (input.spec.monotonicRequired ? monotonicYield : 1) }
}

/** The reference bridge: critical σ's of a pure 11-bit string, per unit of its scale a (σ·a·U = T). */
function referenceU(input: EvaluateInput): { u: Float64Array, trials: number } {
  const ref: CandidateShape = { id: 'bridge-reference', topology: 'string', bits: REFERENCE_BITS, unaryBits: null, coarseBits: null, decode: 'direct', buffered: null }
  const twoR = input.process.twoRConstruction
  const a = inlModel(ref, twoR).scale
  const sampler = (sigmaUnit: number) => createSampler(ref, { sigmaUnit, switchRatio: 0, twoR, offsetSigma: 0, def: input.options.inlDefinition })
  const trials = sizingTrials(2 ** REFERENCE_BITS)
  const sized = sampleSizing({ stream: `bridge-reference:${input.options.inlDefinition}`, sampler, startSigma: 1e-4, pure: true, randomAtZero: false, refine: false, trials }, { inlTargetLsb: 1, dnlTargetLsb: 1, monotonicRequired: false, yieldTarget: 0.5 })
  // crit = T/(a·U) at T = 1: U = 1/(a·crit)
  return { u: sized.crit.inl.map(c => 1 / (a * c)), trials }
}

/** Critical σ's of a bridge of scale a for an INL target T: T/(a·U). */
function bridgeCrit(u: Float64Array, a: number, t: number): Float64Array {
  return u.map(x => t / (a * x))
}

/** Sizing and fast yields of a candidate by the scaled bridge sample (INL) and closed forms (DNL). */
export function closedFormYields(s: CandidateShape, input: EvaluateInput, design: CandidateDesign | null): { sizing: UnitSizing, yields: FastYields, feasible: boolean, sizingSpec: EvaluateInput['spec'], bridge: Float64Array | null, trials: number, given?: SampledSigmas } {
  const { feasible, spec: t } = closedTargets(input, design)
  const twoR = input.process.twoRConstruction
  const model = inlModel(s, twoR)
  if (model.kind !== 'bridge') {
    const sizing = sizeUnit(s, t, input.process)
    return { sizing, yields: closedFormAt(s, input, design, sizing.sigmaUnit), feasible, sizingSpec: t, bridge: null, trials: 0 }
  }
  const ref = referenceU(input)
  const bridge = bridgeCrit(ref.u, model.scale, t.inlTargetLsb)
  const closed = sizeUnit(s, t, input.process)
  const sigmaForInl = sigmaForYield(bridge, t.yieldTarget)
  const given = { trials: ref.trials, sigmaForInl, sigmaForDnl: closed.sigmaForDnl, sigmaForAll: Math.min(sigmaForInl, closed.sigmaForDnl) }
  const sizing = sizeUnit(s, t, input.process, undefined, given)
  const y = closedFormAt(s, input, design, sizing.sigmaUnit)
  const inlYield = feasible ? yieldAt(bridge, sizing.sigmaUnit) : 0
  return { sizing, yields: { ...y, inlYield, yield: inlYield * y.dnlYield * (input.spec.monotonicRequired ? y.monotonicYield : 1) }, feasible, sizingSpec: t, bridge, trials: ref.trials, given }
}

/** Fast yields of a bridge candidate at another σ (the yield-against-area curve). */
export function bridgeYieldsAt(s: CandidateShape, input: EvaluateInput, design: CandidateDesign | null, bridge: Float64Array, sigmaUnit: number): FastYields {
  const y = closedFormAt(s, input, design, sigmaUnit)
  const inlYield = closedTargets(input, design).feasible ? yieldAt(bridge, sigmaUnit) : 0
  return { ...y, inlYield, yield: inlYield * y.dnlYield * (input.spec.monotonicRequired ? y.monotonicYield : 1) }
}

const REFERENCE_BITS = 11
