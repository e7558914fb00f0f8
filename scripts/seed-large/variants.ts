/**
 * Spec variants of the large bench team, each evaluated once by the engine (analytic, trials 0,
 * built-in rule packs) so the revisions' recommendation and the summary_* columns (written by writeRevision's
 * revisionRecord) hold what a real evaluation of that spec says.
 * Invented demo data: the specs are placeholders across the engine's ranges, not products.
 */
import { evaluateSpec, parseEvaluateInput } from '../../shared/core/evaluate'
import { applyFindings } from '../../shared/findings/index'
import type { EvaluateInput, EvaluateOutput } from '../../shared/core/contract/evaluate'

export interface SpecVariant { input: EvaluateInput, results: EvaluateOutput }

const PROCESS = {
  sheetOhmPerSq: 1000, matchingPctUm: 1.0, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 50, switchSkewS: 1e-10,
  switchChargeC: 1e-15, switchAreaUm2: 4, gateAreaUm2: 2, layoutOverhead: 2, minWidthUm: 0.4, minLengthUm: 1
}

/** bits × area budget × INL target: 4 × 3 × 2 = 24 variants. */
function variantSpecs() {
  const specs = []
  for (const bits of [6, 8, 10, 12]) {
    for (const areaBudgetMm2 of [0.01, 0.05, 0.2]) {
      for (const inlTargetLsb of [0.5, 1]) {
        specs.push({
          bits, vrefV: 2.5, updateRateHz: 1e5, loadCapacitanceF: 1e-11, loadResistanceOhm: null, inlTargetLsb, dnlTargetLsb: 0.5,
          yieldTarget: 0.99, monotonicRequired: true, areaBudgetMm2, glitchLimitVs: 5e-11, refSourceOhm: 0, powerBudgetW: 1e-3
        })
      }
    }
  }
  return specs
}

/** Evaluates every variant once (a few seconds in all). */
export async function evaluateVariants(): Promise<SpecVariant[]> {
  const variants: SpecVariant[] = []
  for (const spec of variantSpecs()) {
    const input = parseEvaluateInput({ spec, process: PROCESS, options: { trials: 0, seed: 1 } })
    const results = await applyFindings(input, evaluateSpec(input))
    variants.push({ input, results })
  }
  return variants
}
