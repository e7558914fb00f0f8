import { describe, expect, it } from 'vitest'
import { buildCircuit, elementCounts } from '#shared/core/circuits/index'
import type { CircuitShape } from '#shared/core/circuits/index'
import { solveInputSchema } from '#shared/core/contract/solve'
import type { SolveInput } from '#shared/core/contract/solve'
import { solveCircuit } from '#shared/core/solve/index'
import { createNormalSource } from '#shared/core/stats/rng'

const R = 5e3
const shapes: CircuitShape[] = [
  { topology: 'string', bits: 6, decode: 'direct' },
  { topology: 'string', bits: 6, decode: 'tree' },
  { topology: 'r2r-voltage', bits: 10 },
  { topology: 'r2r-current', bits: 10 },
  { topology: 'segmented', bits: 10, unaryBits: 4 },
  { topology: 'two-stage-string', bits: 8, coarseBits: 4, buffered: true },
  { topology: 'two-stage-string', bits: 8, coarseBits: 4, buffered: false }
]

/** All resistor values of a built circuit, in draw order. */
function resistors(c: SolveInput): number[] {
  switch (c.topology) {
    case 'string': return c.unitsOhm
    case 'r2r-voltage':
    case 'r2r-current': return [...c.legsOhm, ...c.seriesOhm, c.terminationOhm]
    case 'segmented': return [...c.unaryLegsOhm, c.jointOhm, ...c.legsOhm, ...c.seriesOhm, c.terminationOhm]
    case 'two-stage-string': return [...c.coarseOhm, ...c.fineOhm]
  }
}

describe('buildCircuit', () => {
  it('builds valid solve inputs for every shape, nominal and sampled', () => {
    for (const shape of shapes) {
      expect(solveInputSchema.safeParse(buildCircuit(shape, { unitOhm: R, vrefV: 1.2, switchOhm: 10 })).success).toBe(true)
      const sample = buildCircuit(shape, { unitOhm: R, vrefV: 1.2, sigmaUnit: 0.01, normal: createNormalSource(1) })
      expect(solveInputSchema.safeParse(sample).success).toBe(true)
    }
  })

  it('counts CV07 (10-bit R-2R: 20 elements, 31 units) and CV08 (M = 4, L = 6: 28 elements, 50 units) from the built netlist (derived [D])', () => {
    const r2r = buildCircuit({ topology: 'r2r-voltage', bits: 10 }, { unitOhm: R, vrefV: 1 })
    expect(resistors(r2r)).toHaveLength(20)
    expect(resistors(r2r).reduce((s, r) => s + r, 0) / R).toBeCloseTo(31, 12)
    const seg = buildCircuit({ topology: 'segmented', bits: 10, unaryBits: 4 }, { unitOhm: R, vrefV: 1 })
    expect(resistors(seg)).toHaveLength(28)
    expect(resistors(seg).reduce((s, r) => s + r, 0) / R).toBeCloseTo(50, 12)
    expect(elementCounts({ topology: 'r2r-current', bits: 10 })).toEqual({ resistors: 20, units: 31 })
    expect(elementCounts({ topology: 'segmented', bits: 10, unaryBits: 4 })).toEqual({ resistors: 28, units: 50 })
  })

  it('agrees with elementCounts for every shape (resistors counted, units summed from nominal values)', () => {
    for (const shape of shapes) {
      const c = buildCircuit(shape, { unitOhm: R, vrefV: 1 })
      const counts = elementCounts(shape)
      expect(resistors(c)).toHaveLength(counts.resistors)
      expect(resistors(c).reduce((s, r) => s + r, 0) / R).toBeCloseTo(counts.units, 9)
    }
  })

  it('gives the ideal transfer V(k) = V_REF k / 2^N for every nominal shape without switches (textbook / common practice)', () => {
    for (const shape of shapes) {
      const out = solveCircuit(buildCircuit(shape, { unitOhm: R, vrefV: 2 }))
      const n = 2 ** shape.bits
      if (shape.topology === 'r2r-current') {
        out.codes.forEach(c => expect(c.ioutA! * R / 2).toBeCloseTo(c.code / n, 12))
        continue
      }
      if (shape.topology === 'two-stage-string' && !shape.buffered) continue
      out.codes.forEach(c => expect(c.voutV! / 2).toBeCloseTo(c.code / n, 12))
    }
  })

  it('puts N switches in series for a tree-decoded string and one for direct decode (MODELS.md §2.1 counts, Kester handbook [S] / [D])', () => {
    const tree = buildCircuit({ topology: 'string', bits: 8, decode: 'tree' }, { unitOhm: R, vrefV: 1, switchOhm: 100 })
    const direct = buildCircuit({ topology: 'string', bits: 8, decode: 'direct' }, { unitOhm: R, vrefV: 1, switchOhm: 100 })
    expect(tree.switchOhm).toBe(800)
    expect(direct.switchOhm).toBe(100)
  })

  it('draws 2R legs as two independent units: relative σ of a leg is σ_u/√2, of a series R σ_u (MODELS.md §3 convention [D])', () => {
    const normal = createNormalSource(42)
    const sigma = 0.01
    const legs: number[] = []
    const series: number[] = []
    for (let s = 0; s < 4000; s++) {
      const c = buildCircuit({ topology: 'r2r-voltage', bits: 4 }, { unitOhm: R, vrefV: 1, sigmaUnit: sigma, normal })
      if (c.topology !== 'r2r-voltage') throw new Error('unexpected topology')
      legs.push(...c.legsOhm.map(r => r / (2 * R) - 1))
      series.push(...c.seriesOhm.map(r => r / R - 1))
    }
    const sd = (x: number[]) => Math.sqrt(x.reduce((s, v) => s + v * v, 0) / x.length)
    expect(sd(legs) / (sigma / Math.SQRT2)).toBeGreaterThan(0.97)
    expect(sd(legs) / (sigma / Math.SQRT2)).toBeLessThan(1.03)
    expect(sd(series) / sigma).toBeGreaterThan(0.97)
    expect(sd(series) / sigma).toBeLessThan(1.03)
  })

  it('is reproducible from the seed and differs between seeds', () => {
    const opts = (seed: number) => ({ unitOhm: R, vrefV: 1, sigmaUnit: 0.01, normal: createNormalSource(seed) })
    const shape: CircuitShape = { topology: 'segmented', bits: 8, unaryBits: 3 }
    expect(buildCircuit(shape, opts(7))).toEqual(buildCircuit(shape, opts(7)))
    expect(buildCircuit(shape, opts(7))).not.toEqual(buildCircuit(shape, opts(8)))
  })

  it('draws buffer offsets only for buffered two-stage strings', () => {
    const o = { unitOhm: R, vrefV: 1, sigmaUnit: 0.001, sigmaOffsetV: 1e-3, normal: createNormalSource(3) }
    const b = buildCircuit({ topology: 'two-stage-string', bits: 6, coarseBits: 3, buffered: true }, o)
    const u = buildCircuit({ topology: 'two-stage-string', bits: 6, coarseBits: 3, buffered: false }, o)
    expect(b.topology === 'two-stage-string' && b.bufferOffsetV?.every(x => x !== 0)).toBe(true)
    expect(u.topology === 'two-stage-string' && u.bufferOffsetV).toBeFalsy()
  })

  it('refuses to draw a sample without a normal source', () => {
    expect(() => buildCircuit({ topology: 'r2r-voltage', bits: 4 }, { unitOhm: R, vrefV: 1, sigmaUnit: 0.01 })).toThrow(/normal source/)
  })
})

describe('buildCircuit with single-element 2R', () => {
  it('draws each 2R as one element of relative σ_u (MODELS.md §3 alternative convention [D])', () => {
    const normal = createNormalSource(5)
    const sigma = 0.01
    const legs: number[] = []
    for (let s = 0; s < 4000; s++) {
      const c = buildCircuit({ topology: 'r2r-current', bits: 4 }, { unitOhm: R, vrefV: 1, sigmaUnit: sigma, normal, twoR: 'single-element' })
      if (c.topology !== 'r2r-current') throw new Error('unexpected topology')
      legs.push(...c.legsOhm.map(r => r / (2 * R) - 1))
    }
    const sd = Math.sqrt(legs.reduce((s, v) => s + v * v, 0) / legs.length)
    expect(sd / sigma).toBeGreaterThan(0.97)
    expect(sd / sigma).toBeLessThan(1.03)
  })
})
