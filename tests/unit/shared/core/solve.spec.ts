import { describe, expect, it } from 'vitest'
import { TOPOLOGIES } from '#shared/core/contract/solve'
import type { SolveInput, Topology } from '#shared/core/contract/solve'
import { solveCircuit } from '#shared/core/solve/index'
import { referenceCode } from '../../../support/reference-circuits'
import { prng, randomCircuit } from '../../../support/random-circuits'

const R = 10e3
const ideal = {
  vm: (n: number): SolveInput => ({ topology: 'r2r-voltage', bits: n, vrefV: 1, legsOhm: Array(n).fill(2 * R), seriesOhm: Array(n - 1).fill(R), terminationOhm: 2 * R }),
  cm: (n: number): SolveInput => ({ topology: 'r2r-current', bits: n, vrefV: 1, legsOhm: Array(n).fill(2 * R), seriesOhm: Array(n - 1).fill(R), terminationOhm: 2 * R }),
  string: (n: number, r: number): SolveInput => ({ topology: 'string', bits: n, vrefV: 1, unitsOhm: Array(2 ** n).fill(r) }),
  seg: (m: number, l: number): SolveInput => ({
    topology: 'segmented', bits: m + l, unaryBits: m, vrefV: 1, unaryLegsOhm: Array(2 ** m - 1).fill(2 * R), jointOhm: R,
    legsOhm: Array(l).fill(2 * R), seriesOhm: Array(l - 1).fill(R), terminationOhm: 2 * R
  })
}
const rel = (a: number, b: number) => Math.abs(a / b - 1)

describe('check values (MODELS-style table, labels beside each)', () => {
  it('CV01: 5-bit R-2R code 10110 gives 0.6875 V_REF (textbook / common practice)', () => {
    expect(solveCircuit({ ...ideal.vm(5), vrefV: 2.5 }).codes[0b10110]!.voutV).toBeCloseTo(0.6875 * 2.5, 12)
  })

  it('CV02: voltage-mode R-2R R_out = 1.000 R for every code, N = 3…12 (derived, exact nodal [D])', () => {
    for (let n = 3; n <= 12; n++) {
      const out = solveCircuit(ideal.vm(n))
      expect(rel(out.summary.routMinOhm!, R)).toBeLessThan(1e-12)
      expect(rel(out.summary.routMaxOhm!, R)).toBeLessThan(1e-12)
    }
  })

  it('CV03/CV04: 8-bit string of 10 kΩ: R_out 640 kΩ at k = 128, 480 kΩ at k = 64 (derived, formula [D])', () => {
    const out = solveCircuit(ideal.string(8, 10e3))
    expect(rel(out.codes[128]!.routOhm!, 640e3)).toBeLessThan(1e-3)
    expect(rel(out.codes[64]!.routOhm!, 480e3)).toBeLessThan(1e-3)
    expect(out.summary.routMaxOhm).toBeCloseTo(640e3, 3)
  })

  it('CV05: 10-bit string of 1 kΩ loads V_REF with 1.024 MΩ at every code (derived [D])', () => {
    const out = solveCircuit(ideal.string(10, 1e3))
    for (const c of out.codes) expect(rel(1 / c.irefA, 1.024e6)).toBeLessThan(1e-3)
  })

  it('CV08: segmented M = 4, L = 6 has R_out = 0.125 R (derived [D])', () => {
    expect(rel(solveCircuit(ideal.seg(4, 6)).codes[333]!.routOhm!, 0.125 * R)).toBeLessThan(1e-3)
  })

  it('CV27: current-mode R-2R reference input resistance = 1.000 R for every code (derived [D])', () => {
    for (const c of solveCircuit(ideal.cm(8)).codes) expect(rel(1 / c.irefA, R)).toBeLessThan(1e-3)
  })

  it('CV34: segmented M = 4, LSB code 0, m = 8 legs on: R_in = 0.5 R (derived [D])', () => {
    expect(rel(1 / solveCircuit(ideal.seg(4, 6)).codes[8 * 64]!.irefA, 0.5 * R)).toBeLessThan(1e-3)
  })

  it('§2.2 reference load of the voltage-mode ladder: code 0 open, MSB only 4R, all ones ≈ 3R, LSB only ≈ 3R (derived [D])', () => {
    const out = solveCircuit(ideal.vm(10))
    expect(out.codes[0]!.irefA).toBe(0)
    expect(rel(1 / out.codes[512]!.irefA, 4 * R)).toBeLessThan(1e-12)
    expect(rel(1 / out.codes[1023]!.irefA, 3 * R)).toBeLessThan(2 ** -9)
    expect(rel(1 / out.codes[1]!.irefA, 3 * R)).toBeLessThan(2 ** -9)
  })

  it('§2.2 minimum reference load near 9R/(N+1) at the alternating code 0101… (derived [D], ±5 %)', () => {
    for (const n of [8, 10, 12]) {
      const out = solveCircuit(ideal.vm(n))
      expect(rel(out.summary.rinMinOhm!, 9 * R / (n + 1))).toBeLessThan(0.05)
      const alt = parseInt('01'.repeat(n / 2), 2)
      expect(rel(1 / out.codes[alt]!.irefA, out.summary.rinMinOhm!)).toBeLessThan(0.05)
    }
  })

  it('§2.3 current-mode R_out: open at code 0, 2R with MSB only, ≈ 3R with LSB only (derived [D])', () => {
    const out = solveCircuit(ideal.cm(10))
    expect(out.codes[0]!.routOhm).toBeNull()
    expect(rel(out.codes[512]!.routOhm!, 2 * R)).toBeLessThan(1e-12)
    expect(rel(out.codes[1]!.routOhm!, 3 * R)).toBeLessThan(0.01)
    expect(out.codes[1023]!.routOhm!).toBeLessThan(2 * R)
  })

  it('§2.4 segmented reference load with LSB code 0: R_in(m) = 2R/m + 2R/(2^M − m) (derived [D])', () => {
    const out = solveCircuit(ideal.seg(3, 5))
    for (let m = 1; m < 8; m++) expect(rel(1 / out.codes[m * 32]!.irefA, 2 * R / m + 2 * R / (8 - m))).toBeLessThan(1e-12)
  })

  it('§4.4 equal switch resistance r in every leg gives DNL_mid ≈ −2^N r / (6R) (derived, first order [D], ±10 %)', () => {
    const n = 10
    const r = 5
    const out = solveCircuit({ ...ideal.vm(n), switchOhm: r })
    const v = out.codes.map(c => c.voutV!)
    const lsb = (v[1023]! - v[0]!) / 1023
    const dnl = (v[512]! - v[511]!) / lsb - 1
    expect(rel(dnl, -(2 ** n) * r / (6 * R))).toBeLessThan(0.1)
  })
})

describe('two-stage string boundary effects (MODELS.md §2.5)', () => {
  const twoStage = (m: number, l: number, rc: number, buffered: boolean, os?: [number, number]): SolveInput => ({
    topology: 'two-stage-string', bits: m + l, coarseBits: m, vrefV: 1, coarseOhm: Array(2 ** m).fill(rc),
    fineOhm: Array(2 ** l).fill(1), buffered, ...(os ? { bufferOffsetV: os } : {})
  })
  const dnlAt = (c: SolveInput, k: number) => {
    const v = solveCircuit(c).codes.map(e => e.voutV!)
    const lsb = (v.at(-1)! - v[0]!) / (v.length - 1)
    return (v[k]! - v[k - 1]!) / lsb - 1
  }

  it('unbuffered: boundary DNL ≈ R_c / R_f LSB for R_f ≫ R_c (derived, first order [D], ±5 %)', () => {
    for (const ratio of [0.01, 0.002]) expect(rel(dnlAt(twoStage(3, 5, ratio, false), 4 * 32), ratio)).toBeLessThan(0.05)
  })

  it('buffered: the buffers\' offset difference adds directly to the boundary DNL (derived [D], ±2 %)', () => {
    const vLsb = 1 / 256
    const offset = 0.1 * vLsb
    const dnl = dnlAt(twoStage(4, 4, 1, true, [0, offset]), 5 * 16)
    expect(rel(dnl, -(offset / vLsb) * (1 - 2 ** -4))).toBeLessThan(0.02)
    expect(Math.abs(dnlAt(twoStage(4, 4, 1, true), 5 * 16))).toBeLessThan(1e-12)
  })
})

describe('exact solve against a dense nodal reference, every code', () => {
  const cases: Array<[Topology, Record<string, unknown>]> = [
    ['string', { bits: 4, switchOhm: 120 }],
    ['r2r-voltage', { bits: 6, switchOhm: 0 }],
    ['r2r-voltage', { bits: 5, switchOhm: 300 }],
    ['r2r-current', { bits: 6, switchOhm: 150 }],
    ['segmented', { bits: 6, unaryBits: 2, switchOhm: 80 }],
    ['segmented', { bits: 5, unaryBits: 4, switchOhm: 0 }],
    ['two-stage-string', { bits: 5, coarseBits: 2, buffered: false, switchOhm: 60 }],
    ['two-stage-string', { bits: 6, coarseBits: 3, buffered: true, switchOhm: 60 }]
  ]
  for (const [topology, opts] of cases) {
    it(`${topology} ${JSON.stringify(opts)}: value, I_REF and R_out within 1e-12 relative`, () => {
      const rand = prng(topology.length * 97 + Number(opts.bits))
      for (let trial = 0; trial < 3; trial++) {
        const c = randomCircuit(topology, rand, { spread: 0.3, ...opts } as never)
        const out = solveCircuit(c)
        out.codes.forEach((got, k) => {
          const ref = referenceCode(c, k)
          const value = got.voutV ?? got.ioutA!
          const scale = c.topology === 'r2r-current' ? c.vrefV / c.terminationOhm : c.vrefV
          expect(Math.abs(value - ref.value) / scale).toBeLessThan(1e-12)
          expect(Math.abs(got.irefA - ref.irefA)).toBeLessThanOrEqual(1e-12 * Math.abs(ref.irefA) + 1e-18)
          if (ref.routOhm === null) expect(got.routOhm).toBeNull()
          else expect(rel(got.routOhm!, ref.routOhm)).toBeLessThan(1e-11)
        })
      }
    })
  }

  it('covers every topology', () => {
    expect(new Set(cases.map(c => c[0]))).toEqual(new Set(TOPOLOGIES))
  })
})

describe('contract output', () => {
  it('uses ioutA for current mode and voutV elsewhere, one entry per code', () => {
    const cm = solveCircuit(ideal.cm(4))
    expect(cm.output).toBe('current')
    expect(cm.codes).toHaveLength(16)
    expect(cm.codes[5]).toHaveProperty('ioutA')
    expect(cm.codes[5]).not.toHaveProperty('voutV')
    const vm = solveCircuit(ideal.vm(4))
    expect(vm.codes[5]).toHaveProperty('voutV')
    expect(vm.codes.map(c => c.code)).toEqual([...Array(16).keys()])
  })

  it('reports an infinite R_in at code 0 of a voltage-mode ladder as irefA 0 and keeps JSON finite', () => {
    const text = JSON.stringify(solveCircuit(ideal.cm(3)))
    expect(text).not.toMatch(/Infinity|NaN/)
  })
})
