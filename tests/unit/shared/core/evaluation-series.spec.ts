/**
 * The per-code chart series of the evaluate output (linearity.perCode, linearity.dnlEnvelope,
 * linearity.yieldAgainstArea) against computations from the definitions: ngspice (an independent
 * solver) on the candidate's exported nominal netlist, brute force from MODELS.md §1, the
 * Pelgrom area law and the expected range of normal samples.
 */
import { describe, expect, it } from 'vitest'
import type { EvaluateCandidate } from '#shared/core/contract/evaluate'
import { netlistInputSchema } from '#shared/core/contract/netlist'
import { evaluateSpec, parseEvaluateInput } from '#shared/core/evaluate'
import { exportNetlist } from '#shared/core/netlist/export'
import { runNgspice } from '../../../support/ngspice'

const spec = {
  bits: 6, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5,
  yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, refSourceOhm: 0, powerBudgetW: 1e-3
}
// a large switch resistance, so the nominal ladders are visibly non-linear
const process = {
  sheetOhmPerSq: 1000, matchingPctUm: 1.0, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 400, switchSkewS: 1e-10,
  switchChargeC: 1e-15, switchAreaUm2: 4, gateAreaUm2: 2, layoutOverhead: 2, minWidthUm: 0.4, minLengthUm: 1
}
// switches left uncompensated on purpose (switchHandling 'none'): the per-code series must show their error
const options = { topologies: ['string', 'r2r-voltage', 'r2r-current', 'segmented', 'two-stage-string'], trials: 0, seed: 3, inlDefinition: 'endpoint', envelopePoints: 64, switchHandling: 'none' }

type PerCode = Record<'transferErrorLsb' | 'inlLsb' | 'dnlLsb', { codes: number[], min: (number | null)[], max: (number | null)[] }>
type Envelope = { samples: number, codes: number[], dnlMinLsb: number[], dnlMaxLsb: number[] }
type YieldCurve = { model: string, unitAreaUm2: number[], sigmaUnit: number[], inlYield: number[], dnlYield: number[], monotonicYield: number[], yield: number[] }
const perCode = (c: EvaluateCandidate) => (c.linearity as unknown as { perCode: PerCode }).perCode
const envelope = (c: EvaluateCandidate) => (c.linearity as unknown as { dnlEnvelope: Envelope | null }).dnlEnvelope
const yieldCurve = (c: EvaluateCandidate) => (c.linearity as unknown as { yieldAgainstArea: YieldCurve }).yieldAgainstArea
const metric = (c: EvaluateCandidate, k: string) => (c.metrics as Record<string, unknown>)[k] as number

/** MODELS.md §1 from per-code levels: transfer error against k·LSB_ideal, endpoint INL and DNL. */
function fromDefinitions(levels: number[], idealLsb: number) {
  const n = levels.length
  const lsb = (levels[n - 1]! - levels[0]!) / (n - 1)
  return {
    transfer: levels.map((v, k) => v / idealLsb - k),
    inl: levels.map((v, k) => (v - levels[0]!) / lsb - k),
    dnl: levels.slice(0, -1).map((v, k) => (levels[k + 1]! - v) / lsb - 1)
  }
}

describe('nominal per-code series against ngspice', () => {
  const out = evaluateSpec(parseEvaluateInput({ spec, process, options }))
  const cases: Array<[string, Record<string, unknown>]> = [
    ['string-tree', { topology: 'string', decode: 'tree' }],
    ['r2r-voltage', { topology: 'r2r-voltage' }],
    ['r2r-current', { topology: 'r2r-current' }],
    ['segmented-m2', { topology: 'segmented', unaryBits: 2 }],
    ['two-stage-unbuffered', { topology: 'two-stage-string', coarseBits: 3, buffered: false }]
  ]
  for (const [id, candidate] of cases) {
    it(`${id}: transfer error, INL and DNL of every code match the definitions applied to ngspice's DC sweep`, () => {
      const c = out.candidates.find(x => x.id === id)!
      const deck = exportNetlist(netlistInputSchema.parse({ spec, process, candidate, options }))
      const dc = runNgspice(deck.netlist, [deck.dcFile]).files[deck.dcFile]!
      const levels = dc.rows.map(r => r[1]!)
      expect(levels).toHaveLength(64)
      // ideal LSB: V_REF/2^N; current mode I_OUT = (V_REF/R)·k/2^N (MODELS.md §2.3), R the unit the engine sized
      const ideal = id === 'r2r-current' ? spec.vrefV / (metric(c, 'unitOhm') * 64) : spec.vrefV / 64
      const want = fromDefinitions(id === 'r2r-current' ? levels.map(Math.abs) : levels, ideal)
      const got = perCode(c)
      // 64 points for 64 codes: no decimation, min = max = the code's value
      expect(got.dnlLsb.codes).toEqual(Array.from({ length: 63 }, (_, k) => k))
      want.transfer.forEach((v, k) => expect(got.transferErrorLsb.max[k]).toBeCloseTo(v, 6))
      want.inl.forEach((v, k) => expect(got.inlLsb.min[k]).toBeCloseTo(v, 6))
      want.dnl.forEach((v, k) => expect(got.dnlLsb.max[k]).toBeCloseTo(v, 6))
      // the switch resistance shows: the nominal curve is not ideal (derived: 400 Ω in 10 kΩ-class legs)
      if (id !== 'string-tree') expect(Math.max(...want.dnl.map(Math.abs))).toBeGreaterThan(1e-3)
    })
  }
})

describe('decimated series keep the extremes', () => {
  const out = evaluateSpec(parseEvaluateInput({ spec: { ...spec, bits: 12 }, process, options: { ...options, topologies: ['r2r-voltage', 'segmented'], envelopePoints: 32 } }))
  it('the highest |DNL| and |INL| over the buckets are the systematic metrics the engine reports (max over all codes)', () => {
    for (const c of out.candidates) {
      const s = perCode(c)
      expect(s.dnlLsb.codes.length).toBeLessThanOrEqual(32)
      const worst = (x: PerCode['dnlLsb']) => Math.max(...x.max.map(v => Math.abs(v!)), ...x.min.map(v => Math.abs(v!)))
      expect(worst(s.dnlLsb)).toBe(metric(c, 'systematicDnlLsb'))
      expect(worst(s.inlLsb)).toBe(metric(c, 'systematicInlLsb'))
    }
  })
})

/** Expected range of n standard normal samples, ∫ 1 − Φ(x)^n − (1 − Φ(x))^n dx, by the trapezoid rule (erf series). */
function expectedRange(n: number): number {
  const erf = (x: number) => {
    // Abramowitz & Stegun 7.1.26 is too coarse here; the Maclaurin series converges for |x| ≤ 6 in double precision
    let sum = 0
    let term = x
    for (let j = 0; j < 200; j++) {
      sum += term / (2 * j + 1)
      term *= -x * x / (j + 1)
    }
    return (2 / Math.sqrt(Math.PI)) * sum
  }
  const phi = (x: number) => 0.5 * (1 + erf(x / Math.SQRT2))
  let total = 0
  const h = 0.01
  for (let x = -6; x < 6; x += h) {
    const f = (t: number) => 1 - phi(t) ** n - (1 - phi(t)) ** n
    total += (f(x) + f(x + h)) * h / 2
  }
  return total
}

describe('Monte Carlo DNL envelope', () => {
  const input = { spec: { ...spec, bits: 8 }, process: { ...process, switchOhm: 0 }, options: { ...options, topologies: ['string'], trials: 200, envelopePoints: 256 } }
  const out = evaluateSpec(parseEvaluateInput(input))
  it('a string\'s per-code DNL spread over the samples is the range of iid normals with σ = σ_u (MODELS.md §4.2: σ_DNL ≈ σ_u)', () => {
    const c = out.candidates.find(x => x.id === 'string-direct')!
    const e = envelope(c)!
    expect(e.samples).toBe(32)
    expect(e.codes).toHaveLength(255)
    const sigma = metric(c, 'sigmaUnit')
    const meanRange = e.dnlMaxLsb.reduce((s, hi, i) => s + hi - e.dnlMinLsb[i]!, 0) / e.codes.length
    // E[range of 32 normals] ≈ 4.11 σ (computed above from the definition); 255 codes average it to ≈ ±2 %
    expect(meanRange / sigma / expectedRange(32)).toBeGreaterThan(0.94)
    expect(meanRange / sigma / expectedRange(32)).toBeLessThan(1.06)
  })
  it('is reproducible from the seed, changes with it, and leaves the trials alone', () => {
    const again = evaluateSpec(parseEvaluateInput(input))
    expect(envelope(again.candidates[0]!)).toEqual(envelope(out.candidates[0]!))
    const other = evaluateSpec(parseEvaluateInput({ ...input, options: { ...input.options, seed: 4 } }))
    expect(envelope(other.candidates[0]!)!.dnlMaxLsb).not.toEqual(envelope(out.candidates[0]!)!.dnlMaxLsb)
    expect(envelope(evaluateSpec(parseEvaluateInput({ ...input, options: { ...input.options, trials: 0 } })).candidates[0]!)).toBeNull()
  })
  it('16-bit runs sample fewer circuits (4) to keep the evaluation fast', () => {
    const wide = evaluateSpec(parseEvaluateInput({ ...input, spec: { ...spec, bits: 16 }, options: { ...input.options, topologies: ['r2r-voltage'], trials: 20 } }))
    const e = envelope(wide.candidates[0]!)!
    expect(e.samples).toBe(4)
    expect(e.codes.length).toBeLessThanOrEqual(256)
    // the major carry 0111…1 → 1000…0 (step 32767) is inside its bucket
    const b = e.codes.findLastIndex(x => x <= 32767)
    expect(e.codes[b + 1]! > 32767).toBe(true)
  })
})

describe('analytic yield against unit area', () => {
  const out = evaluateSpec(parseEvaluateInput({ spec: { ...spec, bits: 10 }, process, options }))
  it('passes through the candidate\'s own fast yields at its drawn unit and follows the Pelgrom law σ_u ∝ 1/√A (MODELS.md §4.1)', () => {
    for (const c of out.candidates) {
      const y = yieldCurve(c)
      expect(y.model).toBe(metric(c, 'fastYieldTrials') > 0 ? 'sampled' : 'analytic')
      const i = y.unitAreaUm2.indexOf(metric(c, 'unitAreaUm2'))
      expect(i).toBe(8)
      expect(y.inlYield[i]).toBe(metric(c, 'inlYieldAnalytic'))
      expect(y.dnlYield[i]).toBe(metric(c, 'dnlYieldAnalytic'))
      expect(y.monotonicYield[i]).toBe(metric(c, 'monotonicYieldAnalytic'))
      y.unitAreaUm2.forEach((a, j) => expect(y.sigmaUnit[j]! * Math.sqrt(a)).toBeCloseTo(metric(c, 'sigmaUnit') * Math.sqrt(metric(c, 'unitAreaUm2')), 12))
      for (let j = 1; j < y.yield.length; j++) expect(y.yield[j]!).toBeGreaterThanOrEqual(y.yield[j - 1]!)
    }
  })
  it('the DNL yield of a string is Π over the 2^N − 1 steps of (2Φ(T/σ_u) − 1) at every area, within the sizing sample\'s noise (MODELS.md §4.3, σ_DNL ≈ σ_u)', () => {
    // a tight DNL target, so the string is sized by DNL and the curve crosses the interesting range
    const tight = evaluateSpec(parseEvaluateInput({ spec: { ...spec, bits: 10, dnlTargetLsb: 0.02 }, process, options: { ...options, topologies: ['string'] } }))
    const c = tight.candidates.find(x => x.id === 'string-direct')!
    const y = yieldCurve(c)
    const erfc = (x: number) => {
      // continued fraction (Lentz) is overkill: Φ via the series of erf is exact enough for T/σ ≤ 6
      let sum = 0
      let term = x
      for (let j = 0; j < 300; j++) {
        sum += term / (2 * j + 1)
        term *= -x * x / (j + 1)
      }
      return 1 - (2 / Math.sqrt(Math.PI)) * sum
    }
    let checked = 0
    y.sigmaUnit.forEach((s, j) => {
      const z = 0.02 / s
      if (z > 6) return
      const perStep = 1 - erfc(z / Math.SQRT2)
      const want = perStep ** 1023
      // the curve is read from the sizing sample: binomial noise (4 standard errors) plus the fitted tail's slack
      const trials = metric(c, 'fastYieldTrials')
      expect(Math.abs(y.dnlYield[j]! - want)).toBeLessThan(4 * Math.sqrt(want * (1 - want) / trials) + 0.004)
      checked++
    })
    expect(checked).toBeGreaterThan(8)
    expect(Math.min(...y.dnlYield)).toBeLessThan(0.5)
  })
})
