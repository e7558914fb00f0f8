/**
 * Regression guard for the explain-mode refactor: the analytic outputs of a few evaluations were
 * recorded from the engine before the models computed through the formula registry (commit
 * a8a67a1; source: the engine itself, "derived"). Values are rounded to 12 significant figures,
 * so any change beyond floating-point rounding fails. Monte Carlo is off (trials = 0): the
 * sampled kernels are not part of that refactor.
 */
import { describe, expect, it } from 'vitest'
import { evaluateSpec, parseEvaluateInput } from '#shared/core/evaluate'

const ALL = ['string', 'r2r-voltage', 'r2r-current', 'segmented', 'two-stage-string']

const base = {
  spec: {
    bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5,
    yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, refSourceOhm: 0, powerBudgetW: 1e-3
  },
  process: {
    sheetOhmPerSq: 1000, matchingPctUm: 1.0, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 50, switchSkewS: 1e-10,
    switchChargeC: 1e-15, switchAreaUm2: 4, gateAreaUm2: 2, layoutOverhead: 2, minWidthUm: 0.4, minLengthUm: 1
  },
  options: { topologies: ALL, trials: 0, seed: 1, inlDefinition: 'endpoint' }
}

/** Three inputs that reach every branch of the analytic models (given/auto R, pair/single, loads). */
const CASES: Record<string, unknown> = {
  'base 8-bit': base,
  '10-bit auto unit R, resistive load, reference source': {
    ...base,
    spec: { ...base.spec, bits: 10, loadResistanceOhm: 1e6, refSourceOhm: 5, loadCapacitanceF: 2e-12 },
    process: { ...base.process, unitOhm: 'auto', matchingConvention: 'single', twoRConstruction: 'single-element' },
    options: { ...base.options, inlDefinition: 'best-fit' }
  },
  '12-bit no load capacitance, tight targets': {
    ...base,
    spec: { ...base.spec, bits: 12, loadCapacitanceF: 0, inlTargetLsb: 1, dnlTargetLsb: 0.25, yieldTarget: 0.99 },
    process: { ...base.process, unitOhm: 2000, matchingPctUm: 2.5 }
  }
}

const round = (v: unknown): unknown => (typeof v === 'number' && Number.isFinite(v) && v !== 0 ? Number(v.toPrecision(12)) : v)

/** The scalar fields of an object (series and nested sections left out). */
function scalars(o: object): Record<string, unknown> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v === null || typeof v !== 'object').map(([k, v]) => [k, round(v)]))
}

describe('analytic outputs before and after the explain refactor', () => {
  for (const [name, raw] of Object.entries(CASES)) {
    it(`${name}: every candidate's metrics, glitch, reference and output scalars are unchanged`, () => {
      const out = evaluateSpec(parseEvaluateInput(raw))
      const recorded = out.candidates.map(c => ({
        id: c.id,
        metrics: scalars(c.metrics),
        glitch: scalars(c.glitch),
        reference: scalars(c.reference),
        output: scalars(c.output),
        noise: scalars(c.output.noise as object)
      }))
      expect(recorded).toMatchSnapshot()
    })
  }
})
