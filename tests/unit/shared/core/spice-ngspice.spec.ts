/**
 * ngspice (Debian package, an independent solver) against the exact engine: random mismatched
 * circuits of every topology, every code, run from the exported netlists unchanged.
 */
import { describe, expect, it } from 'vitest'
import type { RandomOptions } from '../../../support/random-circuits'
import { prng, randomCircuit } from '../../../support/random-circuits'
import { runNgspice } from '../../../support/ngspice'
import type { SolveInput, Topology } from '#shared/core/contract/solve'
import { spiceNetlist } from '#shared/core/netlist/spice'
import { solveCircuit } from '#shared/core/solve/index'

const TOL = 1e-9

function compare(c: SolveInput): void {
  const exported = spiceNetlist(c)
  const run = runNgspice(exported.netlist, [exported.dcFile, exported.routFile])
  const dc = run.files[exported.dcFile]!
  const rout = run.files[exported.routFile]!
  const out = solveCircuit(c)
  const codes = 2 ** c.bits
  expect(dc.rows).toHaveLength(codes)
  const full = c.topology === 'r2r-current' ? out.summary.irefMaxA : c.vrefV
  const irefScale = out.summary.irefMaxA
  for (let k = 0; k < codes; k++) {
    const [code, value, iref] = dc.rows[k]!
    const got = out.codes[k]!
    expect(code).toBe(k)
    expect(Math.abs(value! - (got.voutV ?? got.ioutA!)) / full).toBeLessThan(TOL)
    expect(Math.abs(iref! - got.irefA)).toBeLessThanOrEqual(TOL * Math.abs(got.irefA) + 1e-15 * irefScale)
    const r = rout.rows[k]![1]!
    if (exported.routColumn === 'gout') {
      const g = got.routOhm === null ? 0 : 1 / got.routOhm
      expect(Math.abs(r - g)).toBeLessThanOrEqual(TOL * g + 1e-18)
    } else {
      // a string's code 0 sits on ground: R_out = R_sw, possibly 0
      expect(Math.abs(r - got.routOhm!)).toBeLessThanOrEqual(TOL * Math.max(got.routOhm!, 1))
    }
  }
}

const cases: Array<[Topology, RandomOptions]> = [
  ['string', { bits: 5, switchOhm: 250 }],
  ['string', { bits: 4, switchOhm: 0 }],
  ['r2r-voltage', { bits: 8, switchOhm: 0 }],
  ['r2r-voltage', { bits: 6, switchOhm: 120 }],
  ['r2r-current', { bits: 8, switchOhm: 0 }],
  ['r2r-current', { bits: 6, switchOhm: 90 }],
  ['segmented', { bits: 7, unaryBits: 3, switchOhm: 40 }],
  ['segmented', { bits: 6, unaryBits: 1, switchOhm: 0 }],
  ['two-stage-string', { bits: 6, coarseBits: 3, buffered: true, switchOhm: 30 }],
  ['two-stage-string', { bits: 6, coarseBits: 2, buffered: false, switchOhm: 30 }],
  ['two-stage-string', { bits: 5, coarseBits: 3, buffered: false, switchOhm: 0 }]
]

describe('exported netlists run in ngspice and reproduce the engine (V, I_REF, R_out within 1e-9)', () => {
  for (const [topology, opts] of cases) {
    it(`${topology} ${JSON.stringify(opts)}, two random mismatched samples`, () => {
      const rand = prng(1000 + topology.length * 31 + opts.bits)
      for (let s = 0; s < 2; s++) compare(randomCircuit(topology, rand, { spread: 0.25, ...opts }))
    })
  }
})

describe('netlist text', () => {
  const c = randomCircuit('segmented', prng(5), { bits: 6, unaryBits: 2, switchOhm: 10 })
  const text = spiceNetlist(c, { note: 'Monte Carlo sample 3 of seed 9' }).netlist

  it('starts with a comment title line, ends with .end and carries the note', () => {
    const lines = text.trim().split('\n')
    expect(lines[0]).toMatch(/^\* Rungwise netlist: segmented, 6 bits/)
    expect(lines.at(-1)).toBe('.end')
    expect(text).toContain('* Monte Carlo sample 3 of seed 9')
  })

  it('gives every element a unique name, a value and a comment line above it', () => {
    const lines = text.split('\n')
    const body = lines.slice(0, lines.indexOf('.control'))
    const names = new Set<string>()
    body.forEach((line, i) => {
      if (line === '' || line.startsWith('*') || line.startsWith('.')) return
      const tokens = line.split(/\s+/)
      expect(tokens.length).toBeGreaterThanOrEqual(3)
      expect(names.has(tokens[0]!.toLowerCase())).toBe(false)
      names.add(tokens[0]!.toLowerCase())
      expect(body[i - 1]).toMatch(/^\* /)
    })
    expect(names.size).toBeGreaterThan(40)
  })

  it('writes every resistor value so that it reads back exactly', () => {
    if (c.topology !== 'segmented') throw new Error('unexpected')
    for (const r of [...c.legsOhm, ...c.unaryLegsOhm, c.jointOhm]) expect(text).toContain(` ${String(r)}\n`)
  })

  it('runs a 12-bit mismatched voltage-mode ladder, all 4096 codes, in ngspice', () => {
    compare(randomCircuit('r2r-voltage', prng(12), { bits: 12, switchOhm: 15 }))
  })
})
