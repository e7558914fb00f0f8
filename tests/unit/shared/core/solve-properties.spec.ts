/**
 * Property tests (fast-check) of the exact solver: laws that hold for every element value.
 */
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { solveInputSchema } from '#shared/core/contract/solve'
import type { SolveInput } from '#shared/core/contract/solve'
import { solveCircuit } from '#shared/core/solve/index'
import { solveNodal } from '../../../support/dense-nodal'
import type { Resistor } from '../../../support/dense-nodal'

const ohms = (n: number) => fc.array(fc.double({ min: 100, max: 1e6, noNaN: true }), { minLength: n, maxLength: n })

const ladderArb = (topology: 'r2r-voltage' | 'r2r-current') => fc.integer({ min: 2, max: 9 }).chain(n => fc.record({
  topology: fc.constant(topology),
  bits: fc.constant(n),
  vrefV: fc.double({ min: 0.1, max: 10, noNaN: true }),
  switchOhm: fc.double({ min: 0, max: 1e3, noNaN: true }),
  legsOhm: ohms(n),
  seriesOhm: ohms(n - 1),
  terminationOhm: fc.double({ min: 100, max: 1e6, noNaN: true })
})) as fc.Arbitrary<SolveInput>

const segmentedArb = fc.integer({ min: 3, max: 9 }).chain(n => fc.integer({ min: 1, max: n - 1 }).chain(m => fc.record({
  topology: fc.constant('segmented' as const),
  bits: fc.constant(n),
  unaryBits: fc.constant(m),
  vrefV: fc.double({ min: 0.1, max: 10, noNaN: true }),
  switchOhm: fc.double({ min: 0, max: 1e3, noNaN: true }),
  unaryLegsOhm: ohms(2 ** m - 1),
  jointOhm: fc.double({ min: 100, max: 1e6, noNaN: true }),
  legsOhm: ohms(n - m),
  seriesOhm: ohms(n - m - 1),
  terminationOhm: fc.double({ min: 100, max: 1e6, noNaN: true })
})))

const value = (c: SolveInput, k: number) => {
  const e = solveCircuit(c).codes[k]!
  return e.voutV ?? e.ioutA!
}

describe('superposition (derived from linearity, MODELS.md §2.2 [D])', () => {
  it('V(a | b) = V(a) + V(b) for disjoint bit sets of any mismatched voltage- or current-mode ladder', () => {
    fc.assert(fc.property(fc.oneof(ladderArb('r2r-voltage'), ladderArb('r2r-current')), fc.nat(), fc.nat(), (c, x, y) => {
      const codes = 2 ** c.bits
      const a = x % codes
      const b = (y % codes) & ~a
      const out = solveCircuit(c)
      const scale = Math.max(...out.codes.map(e => Math.abs(e.voutV ?? e.ioutA!)))
      expect(Math.abs(value(c, a | b) - value(c, a) - value(c, b))).toBeLessThanOrEqual(1e-12 * scale)
    }), { numRuns: 150 })
  })

  it('segmented: V(m, c) = V(m, 0) + V(0, c) and unary legs add one at a time', () => {
    fc.assert(fc.property(segmentedArb, fc.nat(), (c, x) => {
      const l = c.bits - c.unaryBits
      const m = x % 2 ** c.unaryBits
      const lsb = (x >> 3) % 2 ** l
      const v = solveCircuit(c).codes.map(e => e.voutV!)
      expect(Math.abs(v[m * 2 ** l + lsb]! - v[m * 2 ** l]! - v[lsb]!)).toBeLessThanOrEqual(1e-12 * c.vrefV)
    }), { numRuns: 150 })
  })
})

describe('string monotonicity (inherent, Kester handbook [S])', () => {
  it('V(k) strictly increases with k for any positive unit values, and V(0) = 0', () => {
    fc.assert(fc.property(fc.integer({ min: 2, max: 8 }).chain(n => fc.tuple(fc.constant(n), ohms(2 ** n))), fc.double({ min: 0.1, max: 5, noNaN: true }), ([n, unitsOhm], vrefV) => {
      const v = solveCircuit({ topology: 'string', bits: n, vrefV, unitsOhm }).codes.map(e => e.voutV!)
      expect(v[0]).toBe(0)
      for (let k = 1; k < v.length; k++) expect(v[k]!).toBeGreaterThan(v[k - 1]!)
      expect(v.at(-1)!).toBeLessThan(vrefV)
    }), { numRuns: 100 })
  })
})

describe('R_out of an ideal voltage-mode ladder (CV02, derived exact nodal [D])', () => {
  it('is R for every code, every N from 2 to 16 and every R', () => {
    fc.assert(fc.property(fc.integer({ min: 2, max: 16 }), fc.double({ min: 1, max: 1e7, noNaN: true }), fc.nat(), (n, r, x) => {
      const out = solveCircuit({ topology: 'r2r-voltage', bits: n, vrefV: 1, legsOhm: Array(n).fill(2 * r), seriesOhm: Array(n - 1).fill(r), terminationOhm: 2 * r })
      expect(Math.abs(out.codes[x % 2 ** n]!.routOhm! / r - 1)).toBeLessThan(1e-12)
    }), { numRuns: 40 })
  })
})

/** Node voltages of a voltage-mode ladder at code k, from the dense reference. */
function groundReturn(c: Extract<SolveInput, { topology: 'r2r-voltage' }>, k: number): number {
  const net: Resistor[] = []
  const sw = c.switchOhm ?? 0
  const on = (i: number) => (k >> (c.bits - 1 - i)) & 1
  c.legsOhm.forEach((r, i) => net.push({ a: `n${i}`, b: on(i) ? 'ref' : `g${i}`, ohm: r + sw }))
  c.seriesOhm.forEach((r, i) => net.push({ a: `n${i}`, b: `n${i + 1}`, ohm: r }))
  net.push({ a: `n${c.bits - 1}`, b: 'gt', ohm: c.terminationOhm })
  const fixed: Record<string, number> = { ref: c.vrefV, gt: 0 }
  c.legsOhm.forEach((_, i) => {
    if (!on(i)) fixed[`g${i}`] = 0
  })
  const s = solveNodal(net, fixed)
  // current flowing into every ground-side terminal
  return -Object.keys(fixed).filter(n => n !== 'ref').reduce((acc, n) => acc + s.currentOut(n), 0)
}

describe('reference current symmetry', () => {
  it('I_REF drawn from V_REF equals the current returned to ground, code by code (KCL, common practice)', () => {
    fc.assert(fc.property(ladderArb('r2r-voltage'), fc.nat(), (c, x) => {
      if (c.topology !== 'r2r-voltage') return
      const k = x % 2 ** c.bits
      const iref = solveCircuit(c).codes[k]!.irefA
      expect(iref).toBeGreaterThanOrEqual(0)
      expect(Math.abs(iref - groundReturn(c, k))).toBeLessThanOrEqual(1e-10 * iref + 1e-20)
    }), { numRuns: 100 })
  })

  it('ideal segmented with LSB code 0: I_REF(m) = I_REF(2^M − m), the on/off split mirrored (MODELS.md §2.4 formula [D])', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 6 }), fc.integer({ min: 1, max: 6 }), fc.double({ min: 10, max: 1e6, noNaN: true }), (m, l, r) => {
      const c: SolveInput = {
        topology: 'segmented', bits: m + l, unaryBits: m, vrefV: 1, unaryLegsOhm: Array(2 ** m - 1).fill(2 * r), jointOhm: r,
        legsOhm: Array(l).fill(2 * r), seriesOhm: Array(l - 1).fill(r), terminationOhm: 2 * r
      }
      const out = solveCircuit(c)
      for (let k = 1; k < 2 ** m; k++) {
        const a = out.codes[k * 2 ** l]!.irefA
        const b = out.codes[(2 ** m - k) * 2 ** l]!.irefA
        expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-12 * a)
      }
    }), { numRuns: 60 })
  })

  it('current mode: I_REF is the same for every code of any mismatched ladder (MODELS.md §2.3, CV27 generalised [D])', () => {
    fc.assert(fc.property(ladderArb('r2r-current'), (c) => {
      const i = solveCircuit(c).codes.map(e => e.irefA)
      for (const x of i) expect(x).toBe(i[0])
    }), { numRuns: 50 })
  })
})

describe('extreme element values', () => {
  const ext = fc.constantFrom(1e-6, 1e15, 1, 1e3)
  const build = (topology: string, v: number[], sw: number, vrefV: number): unknown => {
    const pick = (k: number, off: number) => v.slice(off, off + k)
    switch (topology) {
      case 'segmented': return { topology, bits: 6, unaryBits: 2, vrefV, switchOhm: sw, unaryLegsOhm: pick(3, 0), jointOhm: v[5], legsOhm: pick(4, 10), seriesOhm: pick(3, 20), terminationOhm: v[30] }
      case 'string': return { topology, bits: 6, vrefV, switchOhm: sw, unitsOhm: v }
      case 'two-stage-string': return { topology, bits: 6, coarseBits: 3, vrefV, switchOhm: sw, coarseOhm: pick(8, 0), fineOhm: pick(8, 8), buffered: v[40]! > 1 }
      default: return { topology, bits: 6, vrefV, switchOhm: sw, legsOhm: pick(6, 0), seriesOhm: pick(5, 10), terminationOhm: v[20] }
    }
  }

  it('keeps every result finite anywhere in the accepted ranges (1e-6 … 1e15 ohms, 1e-6 … 1e6 V)', () => {
    const topologies = fc.constantFrom('r2r-voltage', 'r2r-current', 'segmented', 'string', 'two-stage-string')
    fc.assert(fc.property(topologies, fc.array(ext, { minLength: 64, maxLength: 64 }), fc.constantFrom(0, 1e-3, 1e15), fc.constantFrom(1e-6, 1, 1e6), (t, v, sw, vref) => {
      const input = solveInputSchema.parse(build(t, v, sw, vref))
      const text = JSON.stringify(solveCircuit(input))
      expect(text).not.toMatch(/NaN|Infinity|"(irefA|voutV|ioutA)":null/)
    }), { numRuns: 300 })
  })
})
