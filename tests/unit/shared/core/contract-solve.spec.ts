import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { formatIssues, formatPath } from '#shared/core/contract/errors'
import { netlistInputSchema } from '#shared/core/contract/netlist'
import { MAX_BITS, MIN_BITS, solveInputSchema } from '#shared/core/contract/solve'
import { solveCircuit } from '#shared/core/solve/index'

const ladder = (n: number) => ({
  topology: 'r2r-voltage', bits: n, vrefV: 2.5, legsOhm: Array(n).fill(2e4), seriesOhm: Array(n - 1).fill(1e4), terminationOhm: 2e4
})

function message(input: unknown): string {
  const r = solveInputSchema.safeParse(input)
  if (r.success) throw new Error('expected a validation failure')
  return formatIssues(r.error).message
}

describe('solve input validation messages name the field and the allowed range', () => {
  it('accepts the documented example and every bits value in range', () => {
    expect(solveInputSchema.safeParse(ladder(8)).success).toBe(true)
    expect(solveInputSchema.safeParse(ladder(MIN_BITS)).success).toBe(true)
    expect(solveInputSchema.safeParse(ladder(MAX_BITS)).success).toBe(true)
  })

  it('rejects bits outside 2…16 and says so', () => {
    expect(message({ ...ladder(8), bits: 40 })).toMatch(/^bits: must be an integer from 2 to 16 \(got 40\)/)
    expect(message({ ...ladder(8), bits: 1 })).toMatch(/^bits: must be an integer from 2 to 16 \(got 1\)/)
    expect(message({ ...ladder(8), bits: 7.5 })).toMatch(/^bits: must be an integer from 2 to 16 \(got 7.5\)/)
    expect(message({ ...ladder(8), bits: '8' })).toMatch(/^bits: must be an integer from 2 to 16 \(got "8"\)/)
  })

  it('rejects arrays of the wrong length with the expected count', () => {
    expect(message({ ...ladder(8), legsOhm: Array(7).fill(1) })).toBe('legsOhm: must have 8 values, one leg per bit (got 7)')
    expect(message({ ...ladder(8), seriesOhm: Array(8).fill(1) })).toBe('seriesOhm: must have 7 values, bits − 1 series resistors (got 8)')
    expect(message({ topology: 'string', bits: 3, vrefV: 1, unitsOhm: [1, 2] })).toBe('unitsOhm: must have 8 values, 2^bits unit resistors (got 2)')
  })

  it('rejects zero, negative and non-finite element values at their index', () => {
    expect(message({ ...ladder(4), legsOhm: [1, 0, 1, 1] })).toMatch(/^legsOhm\[1\]: must be a finite number from 1e-6 to 1e15 \(ohms\) \(got 0\)/)
    expect(message({ ...ladder(4), terminationOhm: -5 })).toMatch(/^terminationOhm: must be a finite number from 1e-6 to 1e15 \(ohms\) \(got -5\)/)
    expect(message({ ...ladder(4), terminationOhm: 1e300 })).toMatch(/^terminationOhm: must be a finite number from .* \(got 1e\+300\)/)
    expect(message(JSON.parse('{"topology":"string","bits":2,"vrefV":1e999,"unitsOhm":[1,1,1,1]}'))).toMatch(/^vrefV: must be a finite number from 1e-6 to 1e6 \(volts\) \(got Infinity\)/)
    expect(message({ ...ladder(4), switchOhm: -1 })).toMatch(/^switchOhm: must be a finite number from 0 to 1e15 \(ohms\) \(got -1\)/)
    expect(message({ ...ladder(4), seriesOhm: [1, null, 1] })).toMatch(/^seriesOhm\[1\]: .*\(got null\)/)
  })

  it('rejects an unknown topology, listing the known ones', () => {
    expect(message({ ...ladder(4), topology: 'flash' })).toBe('topology: must be one of string, r2r-voltage, r2r-current, segmented, two-stage-string')
    expect(message({})).toMatch(/^topology: must be one of/)
    expect(message([1, 2])).toBe('(input): must be a JSON object with a topology field')
  })

  it('rejects unknown fields by name (typos must not be ignored)', () => {
    expect(message({ ...ladder(4), switchohm: 3 })).toMatch(/^switchohm: is not a known field \(allowed: .*switchOhm/)
  })

  it('checks the segmented and two-stage splits against bits', () => {
    const seg = { topology: 'segmented', bits: 6, vrefV: 1, unaryBits: 6, unaryLegsOhm: [], jointOhm: 1, legsOhm: [], seriesOhm: [], terminationOhm: 1 }
    expect(message(seg)).toBe('unaryBits: must be an integer from 1 to bits − 1 = 5 (got 6)')
    expect(message({ ...seg, unaryBits: 2, unaryLegsOhm: [1, 1] })).toMatch(/^unaryLegsOhm: must have 3 values/)
    const ts = { topology: 'two-stage-string', bits: 4, vrefV: 1, coarseBits: 2, coarseOhm: [1, 1, 1, 1], fineOhm: [1, 1, 1, 1], buffered: false }
    expect(solveInputSchema.safeParse(ts).success).toBe(true)
    expect(message({ ...ts, bufferOffsetV: [0, 0] })).toBe('bufferOffsetV: is allowed only when buffered is true')
    expect(message({ ...ts, coarseBits: 0 })).toMatch(/^coarseBits: must be an integer from 1 to 15 \(got 0\)/)
  })

  it('says when a field is missing', () => {
    expect(message({ topology: 'r2r-current', bits: 3, legsOhm: [1, 1, 1], seriesOhm: [1, 1], terminationOhm: 1 })).toMatch(/^vrefV: is missing; it must be a finite number from 1e-6 to 1e6 \(volts\)/)
  })

  it('lists at most 20 issues and summarises the rest in the message', () => {
    const r = solveInputSchema.safeParse({ topology: 'string', bits: 6, vrefV: 1, unitsOhm: Array(64).fill(-1) })
    if (r.success) throw new Error('expected failure')
    const f = formatIssues(r.error)
    expect(f.issues).toHaveLength(20)
    expect(f.message).toMatch(/\(and 61 more\)$/)
  })

  it('formats nested paths with dots and indices', () => {
    expect(formatPath(['circuit', 'legsOhm', 3])).toBe('circuit.legsOhm[3]')
    expect(formatPath([])).toBe('(input)')
    expect(formatPath(['a', 'my key', 0])).toBe('a["my key"][0]')
    const r = netlistInputSchema.safeParse({ circuit: { ...ladder(3), legsOhm: [1, -1, 1] } })
    if (r.success) throw new Error('expected failure')
    expect(formatIssues(r.error).message).toMatch(/^circuit\.legsOhm\[1\]: must be a finite number from /)
  })

  it('refuses a netlist note that could break out of its comment line', () => {
    const r = netlistInputSchema.safeParse({ circuit: ladder(3), note: 'x\n.control\nshell rm -rf /' })
    expect(r.success).toBe(false)
  })
})

describe('nothing crashes on arbitrary input', () => {
  it('validation never throws and every failure formats to a message with a field path', () => {
    const field = fc.constantFrom('topology', 'bits', 'vrefV', 'switchOhm', 'legsOhm', 'seriesOhm', 'terminationOhm', 'unitsOhm', 'unaryBits', 'extra')
    const junk = fc.oneof(fc.anything(), fc.double(), fc.integer({ min: -5, max: 40 }), fc.array(fc.double(), { maxLength: 20 }))
    fc.assert(fc.property(fc.oneof(fc.anything(), fc.tuple(field, junk)), (x) => {
      const input = Array.isArray(x) && x.length === 2 && typeof x[0] === 'string' ? { ...ladder(4), [x[0]]: x[1] } : x
      const r = solveInputSchema.safeParse(input)
      if (r.success) {
        for (const c of solveCircuit(r.data).codes) expect(Number.isFinite(c.voutV ?? c.ioutA)).toBe(true)
      } else {
        expect(formatIssues(r.error).message).toMatch(/^(\(input\)|[A-Za-z_$[]).*?: \S/)
      }
    }), { numRuns: 300 })
  })
})
