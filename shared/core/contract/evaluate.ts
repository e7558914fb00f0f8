/**
 * Contract of `cli evaluate` / `POST /api/evaluate`: a spec, a process and options in, ranked
 * candidates out. Field names are fixed (users' scripts depend on them): add, never rename.
 *
 * Supported sizes: `spec.bits` from 2 to 16. Below 2 there is nothing to segment (M runs from 1
 * to N − 1); above 16 the per-code outputs (exact I_REF, R_out and glitch for every code) and a
 * string's 2^N elements per Monte Carlo trial no longer fit the interactive time budget.
 * `options.trials` from 0 (analytic only, the live-preview path) to MAX_TRIALS, and above 12 bits
 * to MAX_TRIALS / 2^(bits − 12), so that a request's Monte Carlo work stays bounded.
 */
import { z } from 'zod'
import { SWITCH_HANDLINGS } from '../models/switch-design'
import { flag, intInRange, oneOf, says, strictKeys } from './fields'

export { evaluateOutputSchema } from './evaluate-output'
export type { CandidateMetrics, EvaluateCandidate, EvaluateOutput } from './evaluate-output'

export const EVALUATE_MIN_BITS = 2
export const EVALUATE_MAX_BITS = 16
export const MAX_TRIALS = 100_000
export const EVALUATE_TOPOLOGIES = ['string', 'r2r-voltage', 'r2r-current', 'segmented', 'two-stage-string'] as const

/** Largest `options.trials` allowed for a resolution (see the file comment). */
export function maxTrialsFor(bits: number): number {
  return bits <= 12 ? MAX_TRIALS : Math.floor(MAX_TRIALS / 2 ** (bits - 12))
}

/** Finite number in [lo, hi] with the range and unit in the message. */
function between(lo: number, hi: number, unit: string) {
  const e = says(`must be a finite number from ${lo} to ${hi}${unit ? ` (${unit})` : ''}`)
  return z.number(e).min(lo, e).max(hi, e)
}

/** Finite number in (0, hi]. */
function above0(hi: number, unit: string) {
  const e = says(`must be a finite number greater than 0 and at most ${hi} (${unit})`)
  return z.number(e).positive(e).max(hi, e)
}

function strict<T extends z.core.$ZodLooseShape>(shape: T) {
  return z.strictObject(shape, strictKeys(Object.keys(shape)))
}

export const evaluateSpecSchema = strict({
  bits: intInRange(EVALUATE_MIN_BITS, EVALUATE_MAX_BITS),
  vrefV: between(0.1, 50, 'V'),
  updateRateHz: between(1, 1e10, 'Hz'),
  loadCapacitanceF: between(0, 1e-6, 'F'),
  loadResistanceOhm: above0(1e12, 'ohms; null for no resistive load').nullable().default(null),
  inlTargetLsb: between(0.01, 64, 'LSB'),
  dnlTargetLsb: between(0.01, 0.999, 'LSB'),
  yieldTarget: between(0.5, 0.999999, 'fraction'),
  monotonicRequired: flag().default(true),
  areaBudgetMm2: between(1e-5, 100, 'mm²'),
  glitchLimitVs: above0(1e-3, 'V·s'),
  refSourceOhm: between(0, 1e9, 'ohms; 0 = buffered reference').default(0),
  powerBudgetW: above0(100, 'W'),
  /** share of the INL budget given to the reference source resistance; default 10 % of inlTargetLsb */
  refInlBudgetLsb: above0(64, 'LSB').optional(),
  temperatureK: between(1, 500, 'K').default(300)
})

export const evaluateProcessSchema = strict({
  sheetOhmPerSq: above0(1e7, 'ohms per square'),
  matchingPctUm: above0(100, '%·µm'),
  matchingConvention: oneOf(['pair', 'single'] as const),
  unitOhm: z.union([above0(1e9, 'ohms'), z.literal('auto')], says('must be a number of ohms from above 0 to 1e9, or "auto"')).default('auto'),
  switchOhm: between(0, 1e7, 'ohms').default(0),
  switchSkewS: between(0, 1e-6, 's').default(0),
  switchChargeC: between(0, 1e-9, 'C').default(0),
  switchAreaUm2: between(0, 1e6, 'µm²').default(0),
  gateAreaUm2: between(0, 1e6, 'µm²').default(0),
  layoutOverhead: between(1, 10, 'factor').default(1.5),
  minWidthUm: above0(1000, 'µm').default(0.4),
  minLengthUm: above0(1000, 'µm').default(1),
  twoRConstruction: oneOf(['two-units', 'single-element'] as const).default('two-units'),
  latchDelayS: between(0, 1e-3, 's').default(0),
  bufferOffsetSigmaV: between(0, 1, 'V').default(0),
  tapChargeFraction: between(0, 1, 'fraction').default(1),
  legChargeFraction: between(0, 1, 'fraction').default(0.1),
  /** spread of the switches' on-resistance relative to the resistors over process and temperature (±%) */
  switchSpreadPct: between(0, 100, '%').default(0),
  /** σ of one process switch's on-resistance about its design value (%, falls as 1/√width) */
  switchMismatchPct: between(0, 100, '%').default(0)
})

const topologyList = z.array(oneOf(EVALUATE_TOPOLOGIES), says(`must be a non-empty list of ${EVALUATE_TOPOLOGIES.join(', ')}`))
  .min(1, says(`must be a non-empty list of ${EVALUATE_TOPOLOGIES.join(', ')}`))
  .max(EVALUATE_TOPOLOGIES.length, says(`must list each of ${EVALUATE_TOPOLOGIES.join(', ')} at most once`))
  .refine(list => new Set(list).size === list.length, says(`must list each of ${EVALUATE_TOPOLOGIES.join(', ')} at most once`))

export const evaluateOptionsSchema = strict({
  topologies: topologyList.default([...EVALUATE_TOPOLOGIES]),
  trials: intInRange(0, MAX_TRIALS).default(2000),
  seed: intInRange(0, 2 ** 32 - 1).default(1),
  inlDefinition: oneOf(['endpoint', 'best-fit'] as const).default('endpoint'),
  envelopePoints: intInRange(16, 1024).default(256),
  confidence: between(0.5, 0.9999, 'fraction').default(0.95),
  /** how ladder and segmented switches are handled: chosen by the engine ('auto') or fixed */
  switchHandling: oneOf(['auto', ...SWITCH_HANDLINGS] as const).default('auto'),
  /** width of the widest switch as a multiple of the process's switch: chosen ('auto') or fixed */
  switchScale: z.union([z.literal('auto'), z.literal(1), z.literal(2), z.literal(4), z.literal(8), z.literal(16), z.literal(32), z.literal(64)],
    says('must be "auto" or one of 1, 2, 4, 8, 16, 32, 64')).default('auto')
})

export const evaluateInputSchema = strict({
  spec: evaluateSpecSchema,
  process: evaluateProcessSchema,
  options: evaluateOptionsSchema.default({
    topologies: [...EVALUATE_TOPOLOGIES], trials: 2000, seed: 1, inlDefinition: 'endpoint', envelopePoints: 256, confidence: 0.95,
    switchHandling: 'auto', switchScale: 'auto'
  })
}).superRefine((v, ctx) => {
  const bits = v.spec.bits
  const cap = maxTrialsFor(bits)
  if (v.options.trials > cap) {
    ctx.addIssue({
      code: 'custom',
      path: ['options', 'trials'],
      input: v.options.trials,
      message: `must be an integer from 0 to ${cap} for ${bits}-bit specs (got ${v.options.trials})`
    })
  }
})

export type EvaluateInput = z.infer<typeof evaluateInputSchema>
export type EvaluateInputRaw = z.input<typeof evaluateInputSchema>
export type EvaluateSpec = EvaluateInput['spec']
export type EvaluateProcess = EvaluateInput['process']
export type EvaluateOptions = EvaluateInput['options']
