/**
 * Fast yield against the unit resistor area, at a ladder of unit areas around the drawn unit
 * (1/16 × … 8 × in √2 steps). At each area the unit σ follows the Pelgrom area law
 * (σ_u = A_R,single/√A, MODELS.md §4.1) and the INL, DNL and monotonicity yields are read from the
 * candidate's sizing sample (handbook §4.9), or from the closed forms of §4.2–§4.5 for arrays too
 * large to sample. At the drawn area the values are the candidate's fast yields exactly.
 */
import type { EvaluateInput } from '../contract/evaluate'
import { SIZING_FORMULAS } from '../explain/registry'
import { singleCoefficientUm } from '../models/sizing'
import type { CandidateContext } from './context'
import { bridgeYieldsAt, closedFormAt } from './fast-closed-form'
import { fastYields } from './sampled-sizing'

/** Unit areas of the curve as multiples of the drawn unit area; 1 (the drawn unit) is included. */
export const YIELD_AREA_FACTORS: readonly number[] = Array.from({ length: 15 }, (_, i) => 2 ** ((i - 8) / 2))

/** The fast yields of one candidate at each unit area (µm²), in increasing area. */
export interface YieldAgainstArea {
  /** 'sampled': read from the sizing sample; 'analytic': closed forms (an estimate) */
  model: 'sampled' | 'analytic'
  unitAreaUm2: number[]
  sigmaUnit: number[]
  inlYield: number[]
  dnlYield: number[]
  monotonicYield: number[]
  yield: number[]
}

/** The curve of one candidate; empty when the candidate has no unit area. */
export function yieldAgainstArea(c: CandidateContext, input: EvaluateInput): YieldAgainstArea {
  const out: YieldAgainstArea = { model: c.sampled || c.bridge ? 'sampled' : 'analytic', unitAreaUm2: [], sigmaUnit: [], inlYield: [], dnlYield: [], monotonicYield: [], yield: [] }
  const a0 = c.sizing.unitAreaUm2
  if (!(a0 > 0)) return out
  const aSingle = singleCoefficientUm(input.process)
  for (const f of YIELD_AREA_FACTORS) {
    const area = f === 1 ? a0 : a0 * f
    const sigma = f === 1 ? c.sizing.sigmaUnit : SIZING_FORMULAS.sigmaAchieved.compute({ A_s: aSingle, A_unit: area })
    const y = f === 1 ? c.fast.yields : c.sampled ? fastYields(c.sampled.crit, sigma) : c.bridge ? bridgeYieldsAt(c.shape, input, c.design, c.bridge, sigma) : closedFormAt(c.shape, input, c.design, sigma)
    out.unitAreaUm2.push(area)
    out.sigmaUnit.push(sigma)
    out.inlYield.push(y.inlYield)
    out.dnlYield.push(y.dnlYield)
    out.monotonicYield.push(y.monotonicYield)
    out.yield.push(y.yield)
  }
  return out
}
