/**
 * The formula registry against the handbook's check values (MODELS.md §9). Each check names the
 * handbook label beside it: S = published source, D = derived, CP = common practice, M = from
 * memory. Tolerance ±0.1 % unless noted. Values are copied from §9 on purpose.
 */
import { describe, expect, it } from 'vitest'
import { defineFormula, FormulaError } from '#shared/core/explain/define'
import { readableFormula } from '#shared/core/explain/explain'
import { allFormulas, COUNT_FORMULAS as C, GLITCH_FORMULAS as G, MATCHING_FORMULAS as M, OUTPUT_FORMULAS as O, SIZING_FORMULAS as S } from '#shared/core/explain/registry'

const rel = (got: number, want: number, tol = 1e-3) => expect(Math.abs(got / want - 1)).toBeLessThanOrEqual(tol)

describe('registry check values (MODELS.md §9)', () => {
  it('CV19 Pelgrom: A_R,single = 1 %·µm, σ_u = 0.1 % → W·L = 100 µm²; as a pair coefficient 50 µm² (S for the law / D)', () => {
    const single = S.singleSingle.compute({ A_R: 1 })
    rel(S.matchingArea.compute({ A_s: single, sigma_u: 0.001 }), 100)
    rel(S.matchingArea.compute({ A_s: S.singlePair.compute({ A_R: 1 }), sigma_u: 0.001 }), 50)
  })

  it('CV21 settling factor ln(2^(N+1)): 8 → 6.2383, 10 → 7.6246, 12 → 9.0109, 16 → 11.7835 (CP, math identity)', () => {
    const factor = (N: number) => O.settling.compute({ tau: 1, N })
    expect([8, 10, 12, 16].map(factor).map(x => Number(x.toFixed(4)))).toEqual([6.2383, 7.6246, 9.0109, 11.7835])
  })

  it('CV22 8-bit string, 10 kΩ unit, 1 pF: τ = 640 ns, t_s = 3.99 µs (D; R_out,max = 2^N·R/4 from §2.1)', () => {
    const tau = O.tau.compute({ R_eff: (2 ** 8 * 10e3) / 4, C_L: 1e-12 })
    rel(tau, 640e-9)
    rel(O.settling.compute({ tau, N: 8 }), 3.99e-6, 2e-3)
  })

  it('CV23 √(4kTRΔf), 10 kΩ, 1 MHz, 300 K = 12.87 µV rms (standard Johnson–Nyquist physics, M for the citation)', () => {
    rel(O.thermalNoise.compute({ T: 300, R: 10e3, df: 1e6 }), 12.87e-6)
  })

  it('CV24 kT at 300 K = 4.1419e-21 J (SI exact k_B, M for the citation)', () => {
    rel(O.thermalNoise.spec.constants!.k_B!.value * 300, 4.1419e-21, 1e-4)
  })

  it('CV25 √(kT/C), 1 pF, 300 K = 64.36 µV rms (CP)', () => {
    rel(O.ktcNoise.compute({ T: 300, C_L: 1e-12 }), 64.36e-6)
  })

  it('CV14 Van den Bosch bound at 99.7 %: 10-bit 0.5265 %, 12-bit 0.2632 %, 14-bit 0.1316 % (M formula / D numbers)', () => {
    rel(M.vanDenBosch.compute({ Y: 0.997, N: 10 }), 0.005265)
    rel(M.vanDenBosch.compute({ Y: 0.997, N: 12 }), 0.002632)
    rel(M.vanDenBosch.compute({ Y: 0.997, N: 14 }), 0.001316)
  })

  it('CV15 bridge bound for a string at 99.7 %: 8-bit 1.733 %, 10-bit 0.8666 % (D)', () => {
    const bound = (N: number) => M.sigmaForInlBridge.compute({ T_INL: 0.5, Y: 0.997, a: M.inlScaleString.compute({ N }) })
    rel(bound(8), 0.01733)
    rel(bound(10), 0.008666)
  })

  it('CV09 10-bit string, σ_u = 0.1 %: σ_INL,mid = 0.0160 LSB, σ_DNL ≈ 0.0010 LSB (D)', () => {
    rel(M.inlSigmaBridge.compute({ a: M.inlScaleString.compute({ N: 10 }), sigma_u: 0.001 }), 0.016, 2e-2)
    rel(M.dnlSigma.compute({ a: M.dnlScaleString.compute({}), sigma_u: 0.001 }), 0.001)
  })

  it('CV16 10-bit R-2R (2R = 2 units), σ_u = 0.1 %: σ_DNL,mid = 0.4575, σ_INL,max = 0.2288 LSB (D, ±0.5 %)', () => {
    const kappa = M.kappaTwoUnits.compute({})
    rel(M.dnlSigma.compute({ a: M.dnlScaleR2r.compute({ kappa, N: 10 }), sigma_u: 0.001 }), 0.4575, 5e-3)
    rel(M.inlSigmaGauss.compute({ a: M.inlScaleR2r.compute({ kappa, N: 10 }), sigma_u: 0.001 }), 0.2288, 5e-3)
  })

  it('CV17 10-bit R-2R at 99.7 % DNL yield: σ_u ≤ 0.03679 % (D)', () => {
    const a = M.dnlScaleR2r.compute({ kappa: M.kappaTwoUnits.compute({}), N: 10 })
    rel(M.sigmaForDnl.compute({ T_DNL: 0.5, Y: 0.997, n: 1, a }), 0.0003679)
  })

  it('CV18 R-2R coefficient with 2R as one unit-area element = 1.155 (D)', () => {
    rel(M.kappaSingle.compute({}), 1.155)
  })

  it('CV30 skew glitch, 12-bit, 2.5 V, Δt = 100 ps: major carry 0.125 nV·s, M = 4 boundary 0.0156 nV·s (D)', () => {
    const vLsb = 2.5 / 2 ** 12
    rel(G.skew.compute({ W_on: 2 ** 11, W_off: 2 ** 11 - 1, V_LSB: vLsb, dt: 1e-10 }), 0.125e-9)
    rel(G.skew.compute({ W_on: 2 ** 8, W_off: 2 ** 8 - 1, V_LSB: vLsb, dt: 1e-10 }), 0.0156e-9, 2e-3)
    expect(G.skew.compute({ W_on: 0, W_off: 0, V_LSB: vLsb, dt: 1e-10 })).toBe(0)
  })

  it('CV06 8-bit string: 256 R, 256 direct switches, tree 510 switches with 8 in series (S: Kester, Data Conversion Handbook / D)', () => {
    expect([C.stringResistors, C.stringDirectSwitches, C.stringTreeSwitches, C.stringTreePath].map(f => f.compute({ N: 8 }))).toEqual([256, 256, 510, 8])
  })

  it('CV07 10-bit R-2R: 20 elements, 31 units (2R = 2 units), 10 SPDT (D)', () => {
    expect([C.r2rResistors.compute({ N: 10 }), C.r2rUnits.compute({ N: 10, u: 2 }), C.r2rSwitches.compute({ N: 10 })]).toEqual([20, 31, 10])
  })

  it('CV08 segmented M = 4, L = 6: 28 elements, 50 units, 21 SPDT (D)', () => {
    expect([C.segResistors.compute({ M: 4, L: 6 }), C.segUnits.compute({ M: 4, L: 6, u: 2 }), C.segSwitches.compute({ M: 4, L: 6 })]).toEqual([28, 50, 21])
  })
})

describe('registry definitions', () => {
  it('gives every formula a handbook section, one of the four labels, units on its output and a readable rendering', () => {
    const labels = new Set(['published', 'derived', 'common-practice', 'memory'])
    for (const f of allFormulas()) {
      expect(f.spec.reference.section, f.spec.id).toMatch(/^§\d/)
      expect(labels.has(f.spec.reference.label), f.spec.id).toBe(true)
      const text = readableFormula(f.spec, f.node)
      expect(text, f.spec.id).not.toMatch(/\*|sqrt\(|Phi\(|1e-300/)
      expect(text.startsWith(`${f.spec.output.symbol} = `), f.spec.id).toBe(true)
    }
  })

  it('shows the DNL yield as the power it computes, without the floor that keeps its logarithm finite (display only; §4.3 formula)', () => {
    const f = allFormulas().find(x => x.spec.id === 'matching.dnl-yield')!
    expect(readableFormula(f.spec, f.node)).toBe('Y_DNL = (2 · Φ(T_DNL / (a · σ_u)) − 1)^n')
  })

  it('refuses a definition whose expression uses an undeclared symbol or declares an unused one', () => {
    const base = { id: 'x', title: 'x', description: 'x', output: { name: 'y', symbol: 'y', unit: '', description: 'y' }, reference: { section: '§1', label: 'derived' as const } }
    expect(() => defineFormula({ ...base, expression: 'a * b', inputs: { a: { symbol: 'a', unit: '', description: '' } } })).toThrow(FormulaError)
    expect(() => defineFormula({ ...base, expression: 'a', inputs: { a: { symbol: 'a', unit: '', description: '' }, b: { symbol: 'b', unit: '', description: '' } } })).toThrow(FormulaError)
  })

  it('refuses to evaluate a formula with an input missing', () => {
    expect(() => O.tau.compute({ R_eff: 1 })).toThrow(/C_L missing/)
  })
})
