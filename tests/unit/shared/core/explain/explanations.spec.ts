/**
 * Every metric of the evaluate output has an explanation, and the explanation's result is the
 * reported number exactly (same compiled expression, same inputs): the engine itself is the
 * reference ("derived"); nothing here is typed in.
 */
import { describe, expect, it } from 'vitest'
import { evaluateSpec, parseEvaluateInput } from '#shared/core/evaluate'
import { explainCandidate, explainMetric } from '#shared/core/explain/index'

const base = {
  spec: {
    bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5,
    yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, refSourceOhm: 0, powerBudgetW: 1e-3
  },
  process: {
    sheetOhmPerSq: 1000, matchingPctUm: 1.0, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 50, switchSkewS: 1e-10,
    switchChargeC: 1e-15, switchAreaUm2: 4, gateAreaUm2: 2, layoutOverhead: 2, minWidthUm: 0.4, minLengthUm: 1
  },
  options: { topologies: ['string', 'r2r-voltage', 'r2r-current', 'segmented', 'two-stage-string'], trials: 500, seed: 3, inlDefinition: 'endpoint' }
}
const CASES = {
  'Monte Carlo 8-bit': base,
  'analytic 10-bit, auto unit R, loads': {
    ...base,
    spec: { ...base.spec, bits: 10, loadResistanceOhm: 1e6, refSourceOhm: 5, loadCapacitanceF: 0, monotonicRequired: false },
    process: { ...base.process, unitOhm: 'auto', matchingConvention: 'single' },
    options: { ...base.options, trials: 0 }
  }
}

describe('explanations of the evaluate output', () => {
  for (const [name, raw] of Object.entries(CASES)) {
    const input = parseEvaluateInput(raw)
    const out = evaluateSpec(input)

    it(`${name}: every metric of every candidate is explained and its result is the reported value exactly`, () => {
      for (const c of out.candidates) {
        const trace = explainCandidate(input, c)
        for (const [metric, value] of Object.entries(c.metrics)) {
          expect(trace[metric], `${c.id}.${metric}`).toBeDefined()
          expect(Object.is(trace[metric]!.result, value), `${c.id}.${metric}: ${String(trace[metric]!.result)} vs ${String(value)}`).toBe(true)
        }
      }
    })

    it(`${name}: every step a formula refers to is explained too, and every entry renders`, () => {
      const trace = explainCandidate(input, out.candidates[0]!)
      for (const [key, use] of Object.entries(trace)) {
        for (const from of Object.values(use.kind === 'formula' ? use.from ?? {} : {})) {
          expect(trace[from], `${key} ← ${from}`).toBeDefined()
        }
        const e = explainMetric(key, use)
        expect(e.reference.section).toMatch(/^§/)
        if (e.kind === 'formula') {
          expect(e.substituted).toMatch(/ = /)
          for (const i of e.inputs) expect(typeof i.value, `${key}.${i.name}`).toBe('number')
        }
      }
    })
  }

  it('names the trials, seed and confidence interval of a Monte Carlo yield', () => {
    const input = parseEvaluateInput(base)
    const c = evaluateSpec(input).candidates[0]!
    const use = explainCandidate(input, c).yield!
    expect(use.kind).toBe('procedure')
    const e = explainMetric('yield', use)
    expect(e.monteCarlo).toMatchObject({ trials: 500, seed: 3, low: c.metrics.yieldLow, high: c.metrics.yieldHigh })
  })

  it('shows the substituted numbers of a formula next to its readable form', () => {
    const input = parseEvaluateInput(base)
    const c = evaluateSpec(input).candidates.find(x => x.id === 'string-direct')!
    const e = explainMetric('tauS', explainCandidate(input, c).tauS!)
    expect(e.readable).toBe('τ = R_out,eff · C_L')
    expect(e.substituted).toBe(`${Number(c.metrics.routMaxOhm!.toPrecision(4))} Ω · 1e-11 F = ${Number(c.metrics.tauS!.toPrecision(4))} s`)
  })
})
