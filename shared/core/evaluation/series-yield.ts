/**
 * Analytic yield against the unit resistor area: the engine's own first-order model evaluated at
 * a ladder of unit areas around the drawn unit (1/16 × … 8 × in √2 steps). At each area the unit σ
 * follows the Pelgrom area law (σ_u = A_R,single/√A, MODELS.md §4.1) and the INL, DNL and
 * monotonicity yields are the analytic formulas of §4.2–§4.5, all through the formula registry
 * (the same formulas explain mode shows). At the drawn area the values are the candidate's
 * analytic yields exactly.
 */
import type { EvaluateInput } from '../contract/evaluate'
import { OUTPUT_FORMULAS, SIZING_FORMULAS } from '../explain/registry'
import { analyticDnlYield, analyticInlYield, analyticMonotonicYield } from '../models/matching'
import { singleCoefficientUm } from '../models/sizing'
import type { CandidateContext } from './context'

/** Unit areas of the curve as multiples of the drawn unit area; 1 (the drawn unit) is included. */
export const YIELD_AREA_FACTORS: readonly number[] = Array.from({ length: 15 }, (_, i) => 2 ** ((i - 8) / 2))

/** The analytic yields of one candidate at each unit area (µm²), in increasing area. */
export interface YieldAgainstArea {
  model: 'analytic'
  unitAreaUm2: number[]
  sigmaUnit: number[]
  inlYield: number[]
  dnlYield: number[]
  monotonicYield: number[]
  yield: number[]
}

/** The curve of one candidate; empty when the candidate has no unit area. */
export function yieldAgainstArea(c: CandidateContext, input: EvaluateInput): YieldAgainstArea {
  const { spec, process } = input
  const out: YieldAgainstArea = { model: 'analytic', unitAreaUm2: [], sigmaUnit: [], inlYield: [], dnlYield: [], monotonicYield: [], yield: [] }
  const a0 = c.sizing.unitAreaUm2
  if (!(a0 > 0)) return out
  const aSingle = singleCoefficientUm(process)
  const twoR = process.twoRConstruction
  for (const f of YIELD_AREA_FACTORS) {
    const area = f === 1 ? a0 : a0 * f
    const sigma = f === 1 ? c.sizing.sigmaUnit : SIZING_FORMULAS.sigmaAchieved.compute({ A_s: aSingle, A_unit: area })
    const yInl = analyticInlYield(c.shape, twoR, sigma, spec.inlTargetLsb)
    const yDnl = analyticDnlYield(c.shape, twoR, sigma, spec.dnlTargetLsb)
    const yMono = analyticMonotonicYield(c.shape, twoR, sigma)
    out.unitAreaUm2.push(area)
    out.sigmaUnit.push(sigma)
    out.inlYield.push(yInl)
    out.dnlYield.push(yDnl)
    out.monotonicYield.push(yMono)
    out.yield.push(OUTPUT_FORMULAS.yieldProduct.compute({ Y_INL: yInl, Y_DNL: yDnl, Y_mono: spec.monotonicRequired ? yMono : 1 }))
  }
  return out
}
