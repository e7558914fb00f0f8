/**
 * The sample study a rule pack is dry-run against when no evaluation is chosen: an invented 10-bit
 * spec on an invented process (demo data, not from any PDK). Analytic only, so it runs in well
 * under a second.
 */
import type { EvaluateInputRaw } from '../core/contract/evaluate'

export const SAMPLE_DRY_RUN_INPUT: EvaluateInputRaw = {
  spec: {
    bits: 10, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 5e-12, loadResistanceOhm: null, inlTargetLsb: 0.5,
    dnlTargetLsb: 0.5, yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 5e-11,
    refSourceOhm: 0, powerBudgetW: 2e-3
  },
  process: {
    sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 50,
    switchSkewS: 1e-10, switchChargeC: 1e-15, switchAreaUm2: 4, gateAreaUm2: 2, layoutOverhead: 2, minWidthUm: 0.4, minLengthUm: 1
  },
  options: { trials: 0, seed: 1 }
}
