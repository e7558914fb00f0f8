import { describe, expect, it } from 'vitest'
import { ZodError } from 'zod'
import { formatIssues } from '#shared/core/contract/errors'
import { evaluateOutputSchema, REQUIRED_METRICS } from '#shared/core/contract/evaluate-output'
import type { EvaluationPart } from '#shared/core/evaluate'
import { ENGINE_VERSION, evaluateSpec, mergeEvaluation, parseEvaluateInput, planEvaluation, runEvaluationTask } from '#shared/core/evaluate'

const base = {
  spec: {
    bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5,
    yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, refSourceOhm: 0, powerBudgetW: 1e-3
  },
  process: {
    sheetOhmPerSq: 1000, matchingPctUm: 1.0, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 50, switchSkewS: 1e-10,
    switchChargeC: 1e-15, switchAreaUm2: 4, gateAreaUm2: 2, layoutOverhead: 2, minWidthUm: 0.4, minLengthUm: 1
  },
  options: { topologies: ['string', 'r2r-voltage', 'r2r-current', 'segmented', 'two-stage-string'], trials: 600, seed: 1, inlDefinition: 'endpoint' }
}

type Raw = typeof base
const withChange = (f: (r: Raw) => void): Raw => {
  const r = structuredClone(base)
  f(r)
  return r
}

function messageOf(raw: unknown): string {
  try {
    parseEvaluateInput(raw)
  } catch (e) {
    if (e instanceof ZodError) {
      return formatIssues(e).message
    }
    throw e
  }
  return 'no error'
}

describe('evaluate output', () => {
  const out = evaluateSpec(parseEvaluateInput(base))

  it('carries the engine version, every fixed metric of every candidate and the whole segmentation sweep', () => {
    expect(out.engineVersion).toBe(ENGINE_VERSION)
    expect(evaluateOutputSchema.safeParse(out).success).toBe(true)
    for (const c of out.candidates) {
      for (const k of REQUIRED_METRICS) {
        expect(c.metrics, `${c.id}.${k}`).toHaveProperty(k)
      }
    }
    const unary = out.candidates.filter(c => c.topology === 'segmented').map(c => c.unaryBits)
    expect(unary).toEqual([1, 2, 3, 4, 5, 6, 7])
    expect(out.candidates.filter(c => c.topology !== 'segmented').every(c => c.unaryBits === null)).toBe(true)
    expect(out.cautions.length).toBeGreaterThan(5)
  })

  it('gives the same result for the same seed and a different one for another seed', () => {
    const again = evaluateSpec(parseEvaluateInput(base))
    expect(JSON.stringify(again.candidates)).toBe(JSON.stringify(out.candidates))
    const other = evaluateSpec(parseEvaluateInput(withChange((r) => {
      r.options.seed = 2
    })))
    expect(JSON.stringify(other.candidates)).not.toBe(JSON.stringify(out.candidates))
  })

  it('merges parts in any order to the same output as the in-process run (worker-count independent)', () => {
    const input = parseEvaluateInput(base)
    const parts: EvaluationPart[] = planEvaluation(input).map(runEvaluationTask).reverse()
    const roundTrip = JSON.parse(JSON.stringify(parts)) as EvaluationPart[]
    expect(JSON.stringify(mergeEvaluation(input, roundTrip).candidates)).toBe(JSON.stringify(out.candidates))
  })

  it('runs analytic-only with trials = 0 (live preview): no Monte Carlo section, analytic yields', () => {
    const preview = evaluateSpec(parseEvaluateInput(withChange((r) => {
      r.options.trials = 0
    })))
    for (const c of preview.candidates) {
      expect(c.linearity.monteCarlo).toBeNull()
      expect(c.metrics.inlYield).toBe(c.metrics.inlYieldAnalytic)
    }
  })

  it('reports R_in of a string as 2^N·R for every code (CV05, 10-bit, 1 kΩ: 1.024 MΩ; D)', () => {
    const o = evaluateSpec(parseEvaluateInput(withChange((r) => {
      r.spec.bits = 10
      r.process.unitOhm = 1000
      r.options.topologies = ['string']
      r.options.trials = 0
    })))
    const m = o.candidates[0]!.metrics
    expect(m.rinMinOhm).toBeCloseTo(1.024e6, -1)
    expect(m.rinMaxOhm).toBeCloseTo(1.024e6, -1)
    expect(m.refLoadCodeDependent).toBe(false)
    expect(m.refSourceMaxOhm).toBeNull()
  })

  it('reports R_in = R for every code of a current-mode ladder (CV27; D) and R_out = R/8 for segmented M = 4 (CV08; D)', () => {
    const o = evaluateSpec(parseEvaluateInput(withChange((r) => {
      r.spec.bits = 10
      r.process.switchOhm = 0
      r.options.topologies = ['r2r-current', 'segmented']
      r.options.trials = 0
    })))
    const cm = o.candidates.find(c => c.id === 'r2r-current')!.metrics
    expect(cm.rinMinOhm! / 10000).toBeCloseTo(1, 9)
    expect(cm.rinMaxOhm! / 10000).toBeCloseTo(1, 9)
    const seg = o.candidates.find(c => c.id === 'segmented-m4')!.metrics
    expect(seg.routMaxOhm! / 10000).toBeCloseTo(0.125, 9)
  })

  it('finds a code-dependent reference load for voltage-mode ladders and sizes the allowed source resistance from it', () => {
    const m = out.candidates.find(c => c.id === 'r2r-voltage')!.metrics
    expect(m.refLoadCodeDependent).toBe(true)
    expect(m.refSourceMaxOhm).toBeGreaterThan(0)
    expect(m.bufferNeeded).toBe(true)
  })
})

describe('bad input is rejected with the field and the allowed range', () => {
  it.each([
    [(r: Raw) => { r.spec.bits = 40 }, 'spec.bits: must be an integer from 2 to 16 (got 40)'],
    [(r: Raw) => { r.spec.bits = 1 }, 'spec.bits: must be an integer from 2 to 16 (got 1)'],
    [(r: Raw) => { r.spec.bits = 12.5 }, 'spec.bits: must be an integer from 2 to 16 (got 12.5)'],
    [(r: Raw) => { r.spec.vrefV = -1 }, 'spec.vrefV: must be a finite number from 0.1 to 50 (V) (got -1)'],
    [(r: Raw) => { r.process.sheetOhmPerSq = 0 }, 'process.sheetOhmPerSq: must be a finite number greater than 0'],
    [(r: Raw) => { r.options.trials = 1e6 }, 'options.trials: must be an integer from 0 to 100000 (got 1000000)'],
    [(r: Raw) => { r.options.topologies = ['string', 'flash'] }, 'options.topologies[1]: must be one of string, r2r-voltage, r2r-current, segmented, two-stage-string']
  ])('%#: names the field and range', (change, expected) => {
    expect(messageOf(withChange(change))).toContain(expected)
  })

  it('caps trials by resolution above 12 bits', () => {
    expect(messageOf(withChange((r) => {
      r.spec.bits = 16
      r.options.trials = 10000
    }))).toContain('options.trials: must be an integer from 0 to 6250 for 16-bit specs (got 10000)')
  })

  it('rejects non-finite numbers, unknown fields and a missing matching convention', () => {
    expect(messageOf(withChange((r) => {
      r.spec.updateRateHz = Number.POSITIVE_INFINITY
    }))).toContain('spec.updateRateHz')
    expect(messageOf({ ...base, extra: 1 })).toContain('extra: is not a known field')
    const noConvention = withChange((r) => {
      delete (r.process as Partial<Raw['process']>).matchingConvention
    })
    expect(messageOf(noConvention)).toContain('process.matchingConvention: is missing; it must be one of pair, single')
  })
})
