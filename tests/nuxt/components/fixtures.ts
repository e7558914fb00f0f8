import { evaluateSpec, parseEvaluateInput } from '../../../shared/core/evaluate'
import { applyFindings, rankEvaluation } from '../../../shared/findings/index'

// A 12-bit spec invented for the tests, in the contract's units; several candidates meet it.
export const SPEC = { bits: 12, vrefV: 2.5, updateRateHz: 1e3, loadCapacitanceF: 10e-12, loadResistanceOhm: null, inlTargetLsb: 1, dnlTargetLsb: 0.5, yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 5e-9, refSourceOhm: 0, powerBudgetW: 50e-3, temperatureK: 300 }
const PROCESS = { sheetOhmPerSq: 300, matchingPctUm: 0.8, matchingConvention: 'pair', switchOhm: 80, switchSkewS: 80e-12, switchChargeC: 2e-15, switchAreaUm2: 6, gateAreaUm2: 3, layoutOverhead: 2, minWidthUm: 0.6, minLengthUm: 1.2 }

/** The engine's own analytic evaluation with findings (what the live preview shows). */
export async function engineOutput(trials = 0) {
  const input = parseEvaluateInput({ spec: SPEC, process: PROCESS, options: { trials, seed: 3, envelopePoints: 64 } })
  const out = await applyFindings(input, evaluateSpec(input))
  return { input, out, ranked: rankEvaluation(input, out, out.findings) }
}
