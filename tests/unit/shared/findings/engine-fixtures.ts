/**
 * Fixtures for the rule tests, produced by running the engine (not typed in): a base spec (the
 * API test's 8-bit spec on an invented demo process) and variants of it, evaluated analytically
 * or with a small seeded Monte Carlo. Results are cached per variant.
 */
import type { EvaluateInput, EvaluateOutput } from '#shared/core/contract/evaluate'
import { evaluateSpec, parseEvaluateInput } from '#shared/core/evaluate'

const BASE = {
  spec: {
    bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5,
    yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, refSourceOhm: 0, powerBudgetW: 1e-3
  },
  process: {
    sheetOhmPerSq: 1000, matchingPctUm: 1.0, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 50, switchSkewS: 1e-10,
    switchChargeC: 1e-15, switchAreaUm2: 4, gateAreaUm2: 2, layoutOverhead: 2, minWidthUm: 0.4, minLengthUm: 1
  },
  // switches left as drawn (no compensation), so the switch rules see the raw switch error they are about
  options: { trials: 0, seed: 7, switchHandling: 'none', switchScale: 1 }
}

interface Change { spec?: Record<string, unknown>, process?: Record<string, unknown>, options?: Record<string, unknown> }

export const VARIANTS = {
  base: {},
  bits10: { spec: { bits: 10 } },
  fast: { spec: { updateRateHz: 1.2e6 } },
  tooFast: { spec: { updateRateHz: 3e6 } },
  tinyArea: { spec: { areaBudgetMm2: 0.0003 } },
  refR: { spec: { refSourceOhm: 10, loadResistanceOhm: 1e6 } },
  noSwitchR: { process: { switchOhm: 0 } },
  bigSwitch10: { spec: { bits: 10 }, process: { switchOhm: 600 } },
  bigSwitch10NoMono: { spec: { bits: 10, monotonicRequired: false }, process: { switchOhm: 600 } },
  mcBase: { options: { trials: 400 } },
  mcSwitch: { process: { switchOhm: 400 }, options: { trials: 400 } },
  mcHugeSwitch: { process: { switchOhm: 3000 }, options: { trials: 400 } },
  mcSwitchNoMono: { spec: { monotonicRequired: false }, process: { switchOhm: 400 }, options: { trials: 400 } },
  lowPower: { spec: { powerBudgetW: 1e-4 } },
  bufferOffset: { process: { bufferOffsetSigmaV: 5e-3 }, options: { trials: 400 } },
  bufferOffsetNoMono: { spec: { monotonicRequired: false }, process: { bufferOffsetSigmaV: 2e-3 }, options: { trials: 400 } }
} satisfies Record<string, Change>
export type Variant = keyof typeof VARIANTS

const cache = new Map<Variant, { input: EvaluateInput, output: EvaluateOutput }>()

/** The engine's input and output for a variant. */
export function evaluated(v: Variant): { input: EvaluateInput, output: EvaluateOutput } {
  let hit = cache.get(v)
  if (!hit) {
    const c: Change = VARIANTS[v]
    const input = parseEvaluateInput({ spec: { ...BASE.spec, ...c.spec }, process: { ...BASE.process, ...c.process }, options: { ...BASE.options, ...c.options } })
    hit = { input, output: evaluateSpec(input) }
    cache.set(v, hit)
  }
  return hit
}
