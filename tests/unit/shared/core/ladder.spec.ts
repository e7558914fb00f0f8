import { describe, expect, it } from 'vitest'
import { ladderRoutOhm, ladderWeights, segmentedRoutOhm, segmentedWeights } from '#shared/core/solve/ladder'
import { chainInverse } from '#shared/core/solve/tridiagonal'
import { solveNodal } from '../../../support/dense-nodal'
import type { Resistor } from '../../../support/dense-nodal'
import { prng } from '../../../support/random-circuits'

function mismatched(rand: () => number, n: number, ohm: number, spread: number): number[] {
  return Array.from({ length: n }, () => ohm * (1 + spread * (2 * rand() - 1)))
}

/** Dense reference netlist of a voltage-mode ladder; leg i ends on source node `s<i>`. */
function ladderNet(legs: number[], series: number[], term: number, sw: number, prefix = 'n'): Resistor[] {
  const net: Resistor[] = []
  legs.forEach((r, i) => net.push({ a: `${prefix}${i}`, b: `${prefix}s${i}`, ohm: r + sw }))
  series.forEach((r, i) => net.push({ a: `${prefix}${i}`, b: `${prefix}${i + 1}`, ohm: r }))
  net.push({ a: `${prefix}${legs.length - 1}`, b: '0', ohm: term })
  return net
}

describe('ladderWeights', () => {
  it('gives exactly binary weights 2^-(i+1) for an ideal R-2R ladder (CV01 basis, textbook / common practice)', () => {
    const w = ladderWeights(new Array(8).fill(2000), new Array(7).fill(1000), 2000)
    for (let i = 0; i < 8; i++) expect(w[i]).toBeCloseTo(2 ** -(i + 1), 15)
  })

  it('reproduces CV01: 5-bit code 10110 gives 0.6875 V_REF (textbook, superposition ½ + ⅛ + 1/16)', () => {
    const w = ladderWeights(new Array(5).fill(20e3), new Array(4).fill(10e3), 20e3)
    const bits = [1, 0, 1, 1, 0]
    const v = bits.reduce((s, b, i) => s + b * w[i]!, 0)
    expect(v).toBeCloseTo(0.6875, 12)
  })

  it('matches a dense Gaussian-elimination nodal solve for random mismatched ladders, every leg', () => {
    const rand = prng(7)
    for (let trial = 0; trial < 30; trial++) {
      const n = 1 + Math.floor(rand() * 12)
      const legs = mismatched(rand, n, 20e3, 0.3)
      const series = mismatched(rand, n - 1, 10e3, 0.3)
      const term = 20e3 * (1 + 0.3 * (2 * rand() - 1))
      const sw = rand() < 0.5 ? 0 : 500 * rand()
      const w = ladderWeights(legs, series, term, sw)
      const net = ladderNet(legs, series, term, sw)
      for (let i = 0; i < n; i++) {
        const fixed: Record<string, number> = {}
        for (let j = 0; j < n; j++) fixed[`ns${j}`] = j === i ? 1 : 0
        expect(Math.abs(w[i]! - solveNodal(net, fixed).v('n0'))).toBeLessThan(1e-13)
      }
      const grounded: Record<string, number> = {}
      for (let j = 0; j < n; j++) grounded[`ns${j}`] = 0
      const rout = solveNodal(net, grounded, { n0: 1 }).v('n0')
      expect(Math.abs(ladderRoutOhm(legs, series, term, sw) / rout - 1)).toBeLessThan(1e-12)
    }
  })

  it('writes into the buffer it is given and returns it', () => {
    const buf = new Float64Array(4)
    const w = ladderWeights([2, 2, 2, 2], [1, 1, 1], 2, 0, buf)
    expect(w).toBe(buf)
    expect(Array.from(buf)).toEqual([0.5, 0.25, 0.125, 0.0625])
  })

  it('gives R_out = R for an ideal ladder of any length (CV02, derived exact nodal [D])', () => {
    for (let n = 3; n <= 12; n++) {
      expect(ladderRoutOhm(new Array(n).fill(2e4), new Array(n - 1).fill(1e4), 2e4)).toBeCloseTo(1e4, 6)
    }
  })
})

describe('segmentedWeights', () => {
  it('matches a dense nodal solve for random mismatched segmented circuits', () => {
    const rand = prng(11)
    for (let trial = 0; trial < 20; trial++) {
      const m = 1 + Math.floor(rand() * 4)
      const l = 1 + Math.floor(rand() * 6)
      const unary = mismatched(rand, 2 ** m - 1, 20e3, 0.3)
      const joint = 10e3 * (1 + 0.3 * (2 * rand() - 1))
      const legs = mismatched(rand, l, 20e3, 0.3)
      const series = mismatched(rand, l - 1, 10e3, 0.3)
      const term = 20e3 * (1 + 0.2 * (2 * rand() - 1))
      const sw = 300 * rand()
      const { unary: wu, binary: wb } = segmentedWeights(unary, joint, legs, series, term, sw)
      const net = ladderNet(legs, series, term, sw)
      unary.forEach((r, j) => net.push({ a: 'out', b: `u${j}`, ohm: r + sw }))
      net.push({ a: 'out', b: 'n0', ohm: joint })
      const sources = [...unary.map((_, j) => `u${j}`), ...legs.map((_, i) => `ns${i}`)]
      const weights = [...wu, ...wb]
      sources.forEach((src, k) => {
        const fixed = Object.fromEntries(sources.map(s => [s, s === src ? 1 : 0]))
        expect(Math.abs(weights[k]! - solveNodal(net, fixed).v('out'))).toBeLessThan(1e-13)
      })
      const grounded = Object.fromEntries(sources.map(s => [s, 0]))
      const rout = solveNodal(net, grounded, { out: 1 }).v('out')
      expect(Math.abs(segmentedRoutOhm(unary, joint, legs, series, term, sw) / rout - 1)).toBeLessThan(1e-12)
    }
  })

  it('gives unary weights 2^L/2^N and binary weights 2^-(M+i+1) when ideal (MODELS-style [D])', () => {
    const { unary, binary } = segmentedWeights(new Array(15).fill(2), 1, new Array(6).fill(2), new Array(5).fill(1), 2)
    for (const u of unary) expect(u).toBeCloseTo(1 / 16, 14)
    binary.forEach((b, i) => expect(b).toBeCloseTo(2 ** -(4 + i + 1), 14))
  })

  it('gives R_out = 2R/2^M = 0.125 R for M = 4 (CV08, derived [D])', () => {
    expect(segmentedRoutOhm(new Array(15).fill(2e4), 1e4, new Array(6).fill(2e4), new Array(5).fill(1e4), 2e4))
      .toBeCloseTo(1250, 6)
  })
})

describe('chainInverse', () => {
  it('inverts the nodal matrix of random chains: G·H = I (dense product check)', () => {
    const rand = prng(23)
    for (let trial = 0; trial < 20; trial++) {
      const n = 1 + Math.floor(rand() * 10)
      const shunt = Array.from({ length: n }, () => 10 ** (-6 + 4 * rand()))
      const series = Array.from({ length: n - 1 }, () => 10 ** (2 + 4 * rand()))
      const h = chainInverse(shunt, series)
      const g = (i: number, j: number): number => {
        if (i === j) return shunt[i]! + (i > 0 ? 1 / series[i - 1]! : 0) + (i < n - 1 ? 1 / series[i]! : 0)
        return Math.abs(i - j) === 1 ? -1 / series[Math.min(i, j)]! : 0
      }
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          let s = 0
          for (let k = 0; k < n; k++) s += g(i, k) * h[k * n + j]!
          expect(Math.abs(s - (i === j ? 1 : 0))).toBeLessThan(1e-9)
        }
      }
    }
  })
})
