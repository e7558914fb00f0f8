import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { solveCircuitArrays } from '#shared/core/solve/index'
import { chargeImpulseVs, glitchTable, skewImpulseVs, transitionActivity } from '#shared/core/models/glitch'
import { rcNoiseVrms, thermalNoiseVrms, ktcNoiseVrms } from '#shared/core/models/noise'
import { allowedSourceOhm, referenceSummary, sourceInducedInlLsb } from '#shared/core/models/reference'
import { candidateShapes } from '#shared/core/models/shapes'
import { minSizeAreaUm2, sizeUnit } from '#shared/core/models/sizing'
import type { SizingProcess, SizingSpec } from '#shared/core/models/sizing'
import { inlAbsLsb, linearityFromLevels, newLinearityResult } from '#shared/core/stats/linearity'

const ALL = ['string', 'r2r-voltage', 'r2r-current', 'segmented', 'two-stage-string'] as const
const spec: SizingSpec = { bits: 10, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.997, powerBudgetW: 1e-3 }
const proc: SizingProcess = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'single', unitOhm: 10000, switchOhm: 0, minWidthUm: 0.4, minLengthUm: 1, twoRConstruction: 'two-units', latchDelayS: 0 }

describe('sizing (MODELS.md §4.1)', () => {
  it('draws W × L with R = R_□·L/W and the larger of the matching and minimum-size areas', () => {
    for (const shape of candidateShapes(10, ALL)) {
      const s = sizeUnit(shape, spec, proc)
      expect(s.unitLengthUm / s.unitWidthUm).toBeCloseTo(10, 9)
      expect(s.unitAreaUm2).toBeCloseTo(Math.max(s.matchingAreaUm2, s.minSizeAreaUm2), 9)
      expect(s.sigmaUnit).toBeLessThanOrEqual(s.sigmaRequired * (1 + 1e-12))
      expect(s.unitWidthUm).toBeGreaterThanOrEqual(0.4 - 1e-12)
    }
  })
  it('uses W_min for long resistors and L_min for wide ones (value-driven minimum)', () => {
    expect(minSizeAreaUm2(10, 0.4, 1)).toBeCloseTo(10 * 0.4 * 0.4, 12)
    expect(minSizeAreaUm2(0.1, 0.4, 1)).toBeCloseTo(0.1 * 10 * 10, 12)
  })
  it('halves the area when the coefficient is a pair value (σ_u = A_pair/√(2WL))', () => {
    const shape = candidateShapes(10, ['r2r-voltage'])[0]!
    const single = sizeUnit(shape, spec, proc)
    const pair = sizeUnit(shape, spec, { ...proc, matchingConvention: 'pair' })
    expect(pair.matchingAreaUm2 / single.matchingAreaUm2).toBeCloseTo(0.5, 12)
  })
  it('chooses R_unit automatically within the power floor', () => {
    const shape = candidateShapes(10, ['r2r-voltage'])[0]!
    const s = sizeUnit(shape, spec, { ...proc, unitOhm: 'auto' })
    // R_in,min ≈ 9R/(N+1) must keep V_REF²/R_in,min within the 1 mW budget
    expect((spec.vrefV ** 2) / ((9 * s.unitOhm) / 11)).toBeLessThanOrEqual(1e-3 * (1 + 1e-9))
  })
})

describe('glitch table (MODELS.md §5)', () => {
  it('puts the worst binary skew glitch at the major carry and none on a direct string', () => {
    const [direct, , r2r] = candidateShapes(8, ALL)
    const p = { switchSkewS: 1e-10, switchChargeC: 0, tapChargeFraction: 1, legChargeFraction: 0.1 }
    const rout = new Float64Array(256).fill(1e4)
    const t = glitchTable(r2r!, 1 / 256, rout, p)
    let worst = 0
    t.totalVs.forEach((v, k) => {
      worst = v > t.totalVs[worst]! ? k : worst
    })
    expect(worst).toBe(127)
    expect(glitchTable(direct!, 1 / 256, rout, p).totalVs.every(v => v === 0)).toBe(true)
  })
  it('tabulated per trailing-ones count, equals the activity of every single transition (brute force, 7 bits)', () => {
    const p = { switchSkewS: 2e-10, switchChargeC: 3e-15, tapChargeFraction: 0.9, legChargeFraction: 0.2 }
    const rout = Float64Array.from({ length: 128 }, (_, k) => 1e3 + 17 * k)
    for (const shape of candidateShapes(7, ALL)) {
      const t = glitchTable(shape, 1 / 128, rout, p)
      for (let k = 0; k < 127; k++) {
        const a = transitionActivity(shape, k, p)
        expect(t.totalVs[k]).toBeCloseTo(skewImpulseVs(a, 1 / 128, 2e-10) + chargeImpulseVs(a, 3e-15, rout[k + 1]!), 25)
        expect(t.toggled[k]).toBe(a.toggled)
      }
    }
  })
  it('adds the charge term α·toggles·q·R_out', () => {
    const [direct] = candidateShapes(4, ['string'])
    const t = glitchTable(direct!, 1 / 16, new Float64Array(16).fill(2e3), { switchSkewS: 0, switchChargeC: 1e-15, tapChargeFraction: 0.5, legChargeFraction: 0 })
    expect(t.totalVs[3]).toBeCloseTo(0.5 * 2 * 1e-15 * 2e3, 25)
  })
})

describe('reference loading (MODELS.md §2.2, §6)', () => {
  const ladder = (bits: number) => solveCircuitArrays({ topology: 'r2r-voltage', bits, vrefV: 1, legsOhm: new Array(bits).fill(2000), seriesOhm: new Array(bits - 1).fill(1000), terminationOhm: 2000 })
  it('finds R_in,min ≈ 9R/(N+1) for a voltage-mode ladder and a code-dependent load (D)', () => {
    const r = referenceSummary(ladder(10).irefA, 1, 0, 0.05, 'endpoint')
    expect(r.refLoadCodeDependent).toBe(true)
    expect(r.rinMinOhm! / (9000 / 11)).toBeGreaterThan(0.9)
    expect(r.rinMinOhm! / (9000 / 11)).toBeLessThan(1.1)
    expect(r.rinMaxOhm).toBeNull()
  })
  it('allows the R_s whose exact INL equals the budget, and that INL is exactly V/(1 + R_s/R_in) of brute-force levels', () => {
    fc.assert(fc.property(fc.integer({ min: 4, max: 10 }), fc.double({ min: 0.01, max: 0.4, noNaN: true }), (bits, budget) => {
      const sol = ladder(bits)
      const rs = allowedSourceOhm(sol.irefA, 1, budget, 'endpoint')
      const levels = Float64Array.from(sol.value, (v, k) => v / (1 + rs * sol.irefA[k]!))
      expect(inlAbsLsb(linearityFromLevels(levels, 'endpoint', newLinearityResult()))).toBeCloseTo(budget, 3)
      expect(sourceInducedInlLsb(sol.irefA, 1, rs, 'endpoint', new Float64Array(sol.irefA.length))).toBeCloseTo(budget, 3)
    }), { numRuns: 20 })
  })
})

describe('noise (MODELS.md §8)', () => {
  it('tends to √(kT/C) for a wide band and to √(4kTRΔf) without a capacitor', () => {
    expect(rcNoiseVrms(1e4, 1e-12, 1e15) / ktcNoiseVrms(1e-12)).toBeCloseTo(1, 5)
    expect(rcNoiseVrms(1e4, 0, 1e6)).toBeCloseTo(thermalNoiseVrms(1e4, 1e6), 15)
  })
})
