/**
 * Fast yields and sizing of the candidates too large to size on a sample (strings above 13 bits,
 * segmented DACs with more than 2^13 unary legs): the closed forms of models/matching.ts, with
 * the targets reduced by the candidate's nominal error at its worst switch corner (a conservative
 * estimate, labelled as such: the nominal error of these arrays is zero or small by design).
 */
import type { EvaluateInput } from '../contract/evaluate'
import { analyticDnlYield, analyticInlYield, analyticMonotonicYield } from '../models/matching'
import type { CandidateShape } from '../models/shapes'
import type { UnitSizing } from '../models/sizing'
import { sizeUnit } from '../models/sizing'
import type { CandidateDesign } from './design'
import type { FastYields } from './sampled-sizing'

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

/** Sizing and fast yields of a candidate by closed forms. */
export function closedFormYields(s: CandidateShape, input: EvaluateInput, design: CandidateDesign | null): { sizing: UnitSizing, yields: FastYields, feasible: boolean, sizingSpec: EvaluateInput['spec'] } {
  const { feasible, spec: t } = closedTargets(input, design)
  const sizing = sizeUnit(s, t, input.process)
  return { sizing, yields: closedFormAt(s, input, design, sizing.sigmaUnit), feasible, sizingSpec: t }
}
