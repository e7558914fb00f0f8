/**
 * Check values of the models handbook (§9) that this engine computes, each with its label as
 * given there: S = published source, D = derived (nodal analysis / Monte Carlo), CP = common
 * practice, M = from memory. Tolerance ±0.1 % unless noted. Values are copied here on purpose.
 */
import { describe, expect, it } from 'vitest'
import { evaluateSpec, parseEvaluateInput } from '#shared/core/evaluate'
import { elementCounts } from '#shared/core/models/counts'
import { settlingFactor } from '#shared/core/models/dynamics'
import { skewImpulseVs, transitionActivity } from '#shared/core/models/glitch'
import { analyticSigmas, r2rDnlCoefficient, sigmaForDnl, sigmaForInl, vanDenBoschSigmaUnit } from '#shared/core/models/matching'
import { BOLTZMANN_J_PER_K, ktcNoiseVrms, thermalNoiseVrms } from '#shared/core/models/noise'
import type { CandidateShape } from '#shared/core/models/shapes'
import { candidateShapes } from '#shared/core/models/shapes'
import { createSampler } from '#shared/core/models/samplers'
import { matchingAreaUm2, singleCoefficientUm } from '#shared/core/models/sizing'
import { kolmogorovQuantile } from '#shared/core/stats/kolmogorov'
import { inlAbsLsb, linearityFromLevels, newLinearityResult } from '#shared/core/stats/linearity'
import { twoSidedFactor } from '#shared/core/stats/normal'

const rel = (got: number, want: number, tol = 1e-3) => expect(Math.abs(got / want - 1)).toBeLessThanOrEqual(tol)
const shapeOf = (bits: number, id: string): CandidateShape => candidateShapes(bits, ['string', 'r2r-voltage', 'r2r-current', 'segmented', 'two-stage-string']).find(s => s.id === id)!
const glitchProcess = { switchSkewS: 1e-10, switchChargeC: 0, tapChargeFraction: 1, legChargeFraction: 0.1 }

/** Per-code levels of a string whose unit i has value units[i] (code k: k units below the tap). */
function stringLevels(units: number[]): Float64Array {
  const total = units.reduce((a, b) => a + b, 0)
  let below = 0
  return Float64Array.from(units, (u) => {
    const v = below / total
    below += u
    return v
  })
}

describe('element counts (MODELS.md §3)', () => {
  it('CV06 8-bit string: 256 R, 256 direct switches; tree 510 switches, 8 in series (S: Kester, Data Conversion Handbook / D)', () => {
    const direct = elementCounts(shapeOf(8, 'string-direct'))
    const tree = elementCounts(shapeOf(8, 'string-tree'))
    expect([direct.resistorCount, direct.switchCount]).toEqual([256, 256])
    expect([tree.switchCount, tree.switchesInPath]).toEqual([510, 8])
  })
  it('CV07 10-bit R-2R: 20 elements, 31 units (2R = 2 units), 10 SPDT (D)', () => {
    const c = elementCounts(shapeOf(10, 'r2r-voltage'))
    expect([c.resistorCount, c.unitResistorCount, c.switchCount]).toEqual([20, 31, 10])
  })
  it('CV08 segmented M=4, L=6: 28 elements, 50 units, 21 SPDT (D)', () => {
    const c = elementCounts(shapeOf(10, 'segmented-m4'))
    expect([c.resistorCount, c.unitResistorCount, c.switchCount]).toEqual([28, 50, 21])
  })
})

describe('mismatch statistics and sizing (MODELS.md §4)', () => {
  it('CV09 10-bit string, σ_u = 0.1 %: σ_INL,mid = 0.0160 LSB, σ_DNL ≈ 0.0010 LSB (D)', () => {
    const s = analyticSigmas(shapeOf(10, 'string-direct'), 'two-units', 0.001)
    rel(s.inlSigmaLsb, 0.016)
    rel(s.dnlSigmaLsb, 0.001)
  })
  it('CV10 worst-case string INL with 1 % matching: N ≤ 6.64 bits (S: Baker worked example)', () => {
    // half the string +1 %, half −1 % gives |INL|max = ½·2^N·δ: within ½ LSB at 6 bits, not at 7
    const worst = (bits: number) => {
      const n = 2 ** bits
      return inlAbsLsb(linearityFromLevels(stringLevels(Array.from({ length: n }, (_, i) => (i < n / 2 ? 1.01 : 0.99))), 'endpoint', newLinearityResult()))
    }
    expect(worst(6)).toBeLessThan(0.5)
    expect(worst(7)).toBeGreaterThan(0.5)
    rel(Math.log2(200) - 1, 6.64, 1e-3)
  })
  it('CV11 linear gradient 0.1 % end to end, 10-bit string: peak INL 0.128 LSB (D)', () => {
    const n = 1024
    const levels = stringLevels(Array.from({ length: n }, (_, i) => 1 + 0.001 * (i / (n - 1) - 0.5)))
    rel(inlAbsLsb(linearityFromLevels(levels, 'endpoint', newLinearityResult())), 0.128, 5e-3)
  })
  it('CV12 C = Φ⁻¹((1+Y)/2): 1.9600, 2.5758, 2.9677, 3.0000 (±1e-4; standard normal quantile)', () => {
    for (const [y, c] of [[0.95, 1.96], [0.99, 2.5758], [0.997, 2.9677], [0.9973, 3.0]] as const) {
      expect(Math.abs(twoSidedFactor(y) - c)).toBeLessThan(1e-4)
    }
  })
  it('CV13 Kolmogorov x_K(Y): 1.3581, 1.6276, 1.8031 (±1e-4; Kolmogorov series, M for the theorem)', () => {
    for (const [y, x] of [[0.95, 1.3581], [0.99, 1.6276], [0.997, 1.8031]] as const) {
      expect(Math.abs(kolmogorovQuantile(y) - x)).toBeLessThan(1e-4)
    }
  })
  it('CV14 Van den Bosch bound at 99.7 %: 0.5265 %, 0.2632 %, 0.1316 % (M formula / D numbers)', () => {
    rel(vanDenBoschSigmaUnit(10, 0.997), 0.005265)
    rel(vanDenBoschSigmaUnit(12, 0.997), 0.002632)
    rel(vanDenBoschSigmaUnit(14, 0.997), 0.001316)
  })
  it('CV15 bridge bound for strings at 99.7 %: 1.733 % (8-bit), 0.8666 % (10-bit) (D)', () => {
    rel(sigmaForInl(shapeOf(8, 'string-direct'), 'two-units', 0.5, 0.997), 0.01733)
    rel(sigmaForInl(shapeOf(10, 'string-direct'), 'two-units', 0.5, 0.997), 0.008666)
  })
  it('CV16 10-bit R-2R (2R = 2 units), σ_u = 0.1 %: σ_DNL,mid = 0.4575 LSB, σ_INL,max = 0.2288 LSB (±0.5 %, D)', () => {
    const s = analyticSigmas(shapeOf(10, 'r2r-voltage'), 'two-units', 0.001)
    rel(s.dnlSigmaLsb, 0.4575, 5e-3)
    rel(s.inlSigmaLsb, 0.2288, 5e-3)
  })
  it('§4.4 equal switch resistance r in every leg: DNL_mid ≈ −2^N·r/(6R) (first order, D; ±3 % at r/R = 0.1 %)', () => {
    const out = newLinearityResult()
    createSampler(shapeOf(10, 'r2r-voltage'), { sigmaUnit: 0, switchRatio: 0.001, twoR: 'two-units', offsetSigma: 0, def: 'endpoint' }).run(new Float64Array(20), out)
    rel(out.dnlMinLsb, -(1024 * 0.001) / 6, 3e-2)
    expect(out.dnlMinCode).toBe(511)
  })
  it('CV17 10-bit R-2R, 99.7 % DNL yield: σ_u ≤ 0.03679 % (D)', () => {
    rel(sigmaForDnl(shapeOf(10, 'r2r-voltage'), 'two-units', 0.5, 0.997), 0.0003679)
  })
  it('CV18 R-2R coefficient with a single unit-area 2R element: 1.155 (D)', () => {
    rel(r2rDnlCoefficient('single-element'), 1.155)
  })
  it('CV19 Pelgrom, A_R,single = 1 %·µm, σ_u = 0.1 %: W·L = 100 µm² (50 µm² if 1 %·µm is the pair value) (S law / D)', () => {
    rel(matchingAreaUm2(singleCoefficientUm({ matchingPctUm: 1, matchingConvention: 'single' }), 0.001), 100)
    rel(matchingAreaUm2(singleCoefficientUm({ matchingPctUm: 1, matchingConvention: 'pair' }), 0.001), 50)
  })
  it('CV20 10-bit, 99.7 %, A_R,single = 1 %·µm: string 1364 µm², R-2R uniform 22 904 µm² (±1 %, D)', () => {
    const a = singleCoefficientUm({ matchingPctUm: 1, matchingConvention: 'single' })
    const string = shapeOf(10, 'string-direct')
    const r2r = shapeOf(10, 'r2r-voltage')
    const sigmaString = Math.min(sigmaForInl(string, 'two-units', 0.5, 0.997), sigmaForDnl(string, 'two-units', 0.5, 0.997))
    const sigmaR2r = Math.min(sigmaForInl(r2r, 'two-units', 0.5, 0.997), sigmaForDnl(r2r, 'two-units', 0.5, 0.997))
    rel(elementCounts(string).unitResistorCount * matchingAreaUm2(a, sigmaString), 1364, 1e-2)
    rel(elementCounts(r2r).unitResistorCount * matchingAreaUm2(a, sigmaR2r), 22904, 1e-2)
  })
})

describe('dynamics, noise and glitch (MODELS.md §5, §6, §8)', () => {
  it('CV21 settling factor ln(2^(N+1)): 6.2383, 7.6246, 9.0109, 11.7835 (CP, math identity)', () => {
    for (const [n, f] of [[8, 6.2383], [10, 7.6246], [12, 9.0109], [16, 11.7835]] as const) {
      rel(settlingFactor(n), f, 1e-4)
    }
  })
  it('CV22 (and CV03) 8-bit string, 10 kΩ, 1 pF, full-scale step: R_out,max 640 kΩ, τ = 640 ns, t_s = 3.99 µs (D)', () => {
    const out = evaluateSpec(parseEvaluateInput({
      spec: { bits: 8, vrefV: 1, updateRateHz: 1e5, loadCapacitanceF: 1e-12, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.997, areaBudgetMm2: 1, glitchLimitVs: 1e-9, powerBudgetW: 1 },
      process: { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'single', unitOhm: 10000 },
      options: { topologies: ['string'], trials: 0 }
    }))
    const m = out.candidates[0]!.metrics
    rel(m.routMaxOhm!, 640e3)
    rel(m.tauS!, 640e-9)
    rel(m.settlingS!, 3.99e-6, 2e-3)
  })
  it('CV23 √(4kTRΔf), 10 kΩ, 1 MHz, 300 K: 12.87 µV rms (standard physics, Johnson–Nyquist; M for citation)', () => {
    rel(thermalNoiseVrms(10e3, 1e6, 300), 12.87e-6)
  })
  it('CV24 kT at 300 K: 4.1419e-21 J = 25.852 meV (SI exact k_B; M for citation)', () => {
    rel(BOLTZMANN_J_PER_K * 300, 4.1419e-21, 1e-4)
    rel((BOLTZMANN_J_PER_K * 300) / 1.602176634e-19, 0.025852, 1e-4)
  })
  it('CV25 √(kT/C), 1 pF, 300 K: 64.36 µV rms (CP)', () => {
    rel(ktcNoiseVrms(1e-12, 300), 64.36e-6)
  })
  it('CV30 glitch, 12-bit, 2.5 V, Δt = 100 ps: binary major carry 0.125 nV·s; M = 4 boundary 0.0156 nV·s (D)', () => {
    const vLsb = 2.5 / 4096
    const carry = skewImpulseVs(transitionActivity(shapeOf(12, 'r2r-voltage'), 2047, glitchProcess), vLsb, 1e-10)
    const boundary = skewImpulseVs(transitionActivity(shapeOf(12, 'segmented-m4'), 255, glitchProcess), vLsb, 1e-10)
    rel(carry, 0.125e-9, 2e-3)
    rel(boundary, 0.0156e-9, 2e-3)
  })
})
