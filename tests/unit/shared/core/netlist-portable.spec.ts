/**
 * The portable SPICE deck: the same element lines as the ngspice deck, a `.dc` sweep and a `.print`,
 * no simulator-specific control block; run by ngspice (Debian package, an independent solver) as
 * a plain deck, its DC sweep reproduces the exact engine at every code (as spice-ngspice.spec.ts
 * does for the ngspice deck). Results are read from ngspice's ASCII raw file (16 digits).
 */
import { spawnSync } from 'node:child_process'
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { NGSPICE, stderrErrors } from '../../../support/ngspice'
import type { RandomOptions } from '../../../support/random-circuits'
import { prng, randomCircuit } from '../../../support/random-circuits'
import { formatIssues } from '#shared/core/contract/errors'
import { netlistInputSchema } from '#shared/core/contract/netlist'
import type { SolveInput, Topology } from '#shared/core/contract/solve'
import { exportNetlist } from '#shared/core/netlist/export'
import { portableNetlist } from '#shared/core/netlist/portable'
import { spiceNetlist } from '#shared/core/netlist/spice'
import { solveCircuit } from '#shared/core/solve/index'

const TOL = 1e-9

/** Runs a deck as it is (no control block of ours) and reads every vector of its raw file. */
function runPlain(netlist: string): Record<string, number[]> {
  const dir = mkdtempSync(join(tmpdir(), 'rungwise-portable-'))
  try {
    writeFileSync(join(dir, 'deck.cir'), netlist)
    const r = spawnSync(NGSPICE, ['-b', '-r', 'deck.raw', 'deck.cir'], { cwd: dir, encoding: 'utf8', env: { ...process.env, SPICE_ASCIIRAWFILE: '1' }, maxBuffer: 64 * 2 ** 20 })
    if (r.status !== 0 || stderrErrors(r.stderr) !== '') throw new Error(`ngspice failed (exit ${r.status}): ${stderrErrors(r.stderr).slice(0, 2000)}`)
    const raw = readFileSync(join(dir, 'deck.raw'), 'utf8')
    const [head, values] = raw.split(/^Values:\s*$/m) as [string, string]
    const names = head.split(/^Variables:\s*$/m)[1]!.trim().split('\n').map(l => l.trim().split(/\s+/)[1]!)
    const numbers = values.trim().split(/\s+/).map(Number)
    const vectors: Record<string, number[]> = Object.fromEntries(names.map(n => [n, []]))
    for (let p = 0; p < numbers.length; p += names.length + 1) names.forEach((n, i) => vectors[n]!.push(numbers[p + 1 + i]!))
    return vectors
  } finally {
    rmSync(dir, { recursive: true, force: true })
  }
}

/** Element lines: everything that is neither a comment nor a dot card. */
const elementLines = (text: string) => text.split('\n').filter(l => l !== '' && !l.startsWith('*') && !l.startsWith('.'))

function compare(c: SolveInput): void {
  const portable = portableNetlist(c)
  const v = runPlain(portable.netlist)
  const out = solveCircuit(c)
  const current = c.topology === 'r2r-current'
  const outputs = v[current ? 'i(voutp)' : 'v(out)']!
  const full = current ? out.summary.irefMaxA : c.vrefV
  expect(outputs).toHaveLength(2 ** c.bits)
  out.codes.forEach((got, k) => {
    expect(Math.abs(outputs[k]! - (got.voutV ?? got.ioutA!)) / full).toBeLessThan(TOL)
    // the current through VREF flows into its + node: minus the current drawn from the reference
    expect(Math.abs(-v['i(vref)']![k]! - got.irefA)).toBeLessThanOrEqual(TOL * Math.abs(got.irefA) + 1e-15 * out.summary.irefMaxA)
  })
}

const cases: Array<[Topology, RandomOptions]> = [
  ['string', { bits: 5, switchOhm: 250 }],
  ['r2r-voltage', { bits: 6, switchOhm: 120 }],
  ['r2r-current', { bits: 6, switchOhm: 90 }],
  ['segmented', { bits: 6, unaryBits: 2, switchOhm: 40 }],
  ['two-stage-string', { bits: 6, coarseBits: 3, buffered: true, switchOhm: 30 }],
  ['two-stage-string', { bits: 5, coarseBits: 2, buffered: false, switchOhm: 0 }]
]

describe('portable SPICE deck', () => {
  for (const [topology, opts] of cases) {
    it(`${topology} ${JSON.stringify(opts)}: run as a plain deck, the sweep reproduces the engine within 1e-9`, () => {
      compare(randomCircuit(topology, prng(2000 + opts.bits * 7 + topology.length), { spread: 0.25, ...opts }))
    })
  }

  it('has the ngspice deck\'s elements, a .dc sweep and a .print, and no control block or result files', () => {
    const c = randomCircuit('segmented', prng(5), { bits: 5, unaryBits: 2, switchOhm: 10, spread: 0.1 })
    const portable = portableNetlist(c, { note: 'check' }).netlist
    const ngspice = spiceNetlist(c, { note: 'check' }).netlist.replace(/^\.control$[\s\S]*?^\.endc$/m, '')
    // the R_out probe (only the ngspice deck's second sweep uses it) is the one element left out
    expect(elementLines(portable)).toEqual(elementLines(ngspice).filter(l => !l.startsWith('IPROBE ')))
    expect(portable).not.toMatch(/^\.control|^\.endc|wrdata|^quit/im)
    expect(portable).toMatch(/^\.dc VCODE 0 31 1$/m)
    expect(portable).toMatch(/^\.print dc v\(out\) i\(vref\)$/m)
    expect(portable.trimEnd().endsWith('.end')).toBe(true)
  })

  it('is the netlist contract\'s deck: "portable" (other values refused, naming the field)', () => {
    const ladder = { topology: 'r2r-voltage', bits: 3, vrefV: 1, legsOhm: [2e4, 2e4, 2e4], seriesOhm: [1e4, 1e4], terminationOhm: 2e4 }
    const out = exportNetlist(netlistInputSchema.parse({ circuit: ladder, deck: 'portable' }))
    expect(out).toMatchObject({ deck: 'portable', format: 'spice', dcFile: '', routFile: '', printColumns: ['v(out)', 'i(vref)'] })
    expect(out.netlist).not.toContain('.control')
    expect(exportNetlist(netlistInputSchema.parse({ circuit: ladder })).netlist).toContain('.control')
    const bad = netlistInputSchema.safeParse({ circuit: ladder, deck: 'hspice' })
    expect(bad.success).toBe(false)
    expect(formatIssues(bad.error!).message).toBe('deck: must be one of ngspice, portable (got "hspice")')
  })
})
