/**
 * Netlist export of a candidate from a spec: sized like the evaluation, nominal or one sample,
 * and the exported deck still reproduces the exact solve in ngspice.
 */
import { describe, expect, it } from 'vitest'
import { formatIssues } from '#shared/core/contract/errors'
import { netlistInputSchema } from '#shared/core/contract/netlist'
import type { NetlistInput } from '#shared/core/contract/netlist'
import { exportNetlist } from '#shared/core/netlist/export'
import { solveCircuit } from '#shared/core/solve/index'
import { runNgspice } from '../../../support/ngspice'

const spec = {
  bits: 6, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, inlTargetLsb: 0.5, dnlTargetLsb: 0.5,
  yieldTarget: 0.997, areaBudgetMm2: 0.1, glitchLimitVs: 1e-9, powerBudgetW: 0.01
}
const process = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'single', unitOhm: 10e3, switchOhm: 50, bufferOffsetSigmaV: 1e-3 }

function parse(raw: unknown): NetlistInput {
  const r = netlistInputSchema.safeParse(raw)
  if (!r.success) throw new Error(formatIssues(r.error).message)
  return r.data
}

function errorOf(raw: unknown): string {
  const r = netlistInputSchema.safeParse(raw)
  if (r.success) throw new Error('expected a validation failure')
  return formatIssues(r.error).message
}

describe('netlist of a candidate from a spec', () => {
  it('builds the nominal circuit with the given unit R and switch (R-2R legs = 2 units, switches left as they are)', () => {
    const out = exportNetlist(parse({ spec, process, candidate: { topology: 'r2r-voltage' }, sample: null, options: { switchHandling: 'none', switchScale: 1 } }))
    expect(out.circuit?.topology).toBe('r2r-voltage')
    if (out.circuit?.topology !== 'r2r-voltage') throw new Error('unexpected')
    expect(out.circuit.legsOhm).toEqual(Array(6).fill(20e3))
    expect(out.circuit.seriesOhm).toEqual(Array(5).fill(10e3))
    expect(out.circuit.legSwitchOhm).toEqual(Array(6).fill(50))
    expect(out.design).toEqual({ handling: 'none', scale: 1, corner: 0 })
    expect(out.sizing?.unitOhm).toBe(10e3)
    expect(out.sample).toBeNull()
    expect(out.netlist).toMatch(/^\* candidate r2r-voltage, nominal; unit R = 10000 ohm/m)
  })

  it('puts N switches in series for a tree-decoded string (MODELS.md §2.1 [D])', () => {
    const out = exportNetlist(parse({ spec, process, candidate: { topology: 'string', decode: 'tree' } }))
    expect(out.circuit?.switchOhm).toBe(6 * 50)
  })

  it('draws a reproducible Monte Carlo sample with the sized σ_u, different per index', () => {
    const raw = { spec, process, candidate: { topology: 'segmented', unaryBits: 3 }, sample: { seed: 7, index: 2 }, options: { switchHandling: 'absorbed' } }
    const a = exportNetlist(parse(raw))
    expect(exportNetlist(parse(raw)).netlist).toBe(a.netlist)
    expect(exportNetlist(parse({ ...raw, sample: { seed: 7, index: 3 } })).netlist).not.toBe(a.netlist)
    if (a.circuit?.topology !== 'segmented') throw new Error('unexpected')
    // the engine absorbs the 50 Ω switch into each leg (2R − r), so legs are drawn about 20 kΩ − 50 Ω
    expect(a.design?.handling).toBe('absorbed')
    const rel = a.circuit.unaryLegsOhm.map(r => r / (20e3 - 50) - 1)
    expect(rel.some(x => x !== 0)).toBe(true)
    const sigma = a.sizing!.sigmaUnit
    for (const x of rel) expect(Math.abs(x)).toBeLessThan(6 * sigma)
    expect(a.netlist).toContain('Monte Carlo sample index 2 of seed 7')
  })

  it('gives unbuffered two-stage strings coarse units 2^L times smaller than fine ones', () => {
    const out = exportNetlist(parse({ spec, process, candidate: { topology: 'two-stage-string', buffered: false } }))
    if (out.circuit?.topology !== 'two-stage-string') throw new Error('unexpected')
    expect(out.circuit.coarseBits).toBe(3)
    expect(out.circuit.coarseOhm[0]! * 8).toBeCloseTo(out.circuit.fineOhm[0]!, 9)
  })

  it('runs in ngspice and reproduces the solve of the circuit it returns (sampled buffered two-stage, segmented)', () => {
    for (const candidate of [{ topology: 'two-stage-string', buffered: true }, { topology: 'segmented', unaryBits: 2 }, { topology: 'r2r-current' }]) {
      const out = exportNetlist(parse({ spec, process, candidate, sample: { seed: 1, index: 0 } }))
      const run = runNgspice(out.netlist, [out.dcFile])
      const solved = solveCircuit(out.circuit!)
      const full = solved.output === 'current' ? solved.summary.irefMaxA : spec.vrefV
      run.files[out.dcFile]!.rows.forEach(([k, v]) => {
        const e = solved.codes[k!]!
        expect(Math.abs(v! - (e.voutV ?? e.ioutA!)) / full).toBeLessThan(1e-9)
      })
    }
  })
})

describe('netlist input validation', () => {
  it('names missing and misplaced candidate fields', () => {
    expect(errorOf({ spec, process, candidate: { topology: 'segmented' } })).toBe('candidate.unaryBits: is missing; it must be an integer from 1 to bits − 1 = 5')
    expect(errorOf({ spec, process, candidate: { topology: 'segmented', unaryBits: 6 } })).toBe('candidate.unaryBits: must be an integer from 1 to bits − 1 = 5 (got 6)')
    expect(errorOf({ spec, process, candidate: { topology: 'r2r-voltage', decode: 'tree' } })).toBe('candidate.decode: is only used by string candidates')
    expect(errorOf({ spec, process, candidate: { topology: 'ladder' } })).toMatch(/^candidate\.topology: must be one of string, r2r-voltage/)
  })

  it('validates the sample and the spec with field paths', () => {
    expect(errorOf({ spec, process, candidate: { topology: 'string' }, sample: { seed: -1, index: 0 } })).toMatch(/^sample/)
    expect(errorOf({ spec: { ...spec, bits: 30 }, process, candidate: { topology: 'string' } })).toMatch(/^spec\.bits: must be an integer from 2 to 16 \(got 30\)/)
  })

  it('reports the closer form when neither matches', () => {
    expect(errorOf({})).toMatch(/^circuit: is missing/)
    expect(errorOf({ circuit: { topology: 'string', bits: 99 } })).toMatch(/^circuit\.bits: must be an integer from 2 to 16 \(got 99\)/)
  })
})
