import { describe, expect, it } from 'vitest'
import { benchSummary, parseBenchCsv } from '#shared/io/benchCsv'
import { codeRanges } from '#shared/io/benchFormat'

/**
 * Worked example, computed by hand from the published definitions (IEEE Std 1658-2011 as restated
 * in MODELS.md §1: endpoint LSB_a = (V(n−1) − V(0))/(n − 1), INL(k) = (V(k) − V(0))/LSB_a − k,
 * DNL(k) = (V(k+1) − V(k))/LSB_a − 1; best-fit: the least-squares line through all V(k)).
 * 3 bits, levels in volts: 0, 1, 2.1, 2.9, 4.2, 5, 5.8, 7.
 *   endpoint: LSB_a = 7/7 = 1 V; INL = 0, 0, 0.1, −0.1, 0.2, 0, −0.2, 0; steps 1, 1.1, 0.8, 1.3, 0.8, 0.8, 1.2
 *   → DNL max 0.3 (code 3), min −0.2 (code 2).
 *   best-fit: mean k = 3.5, mean V = 28/8 = 3.5, Sxy = 41.5, Sxx = 42 → slope s = 83/84, offset a = 1/24;
 *   INL(k) = (V(k) − 1/24)·84/83 − k → max 17.3/83 at code 4, min −14.3/83 at code 6;
 *   DNL = step·84/83 − 1 → max 26.2/83 (code 3), min −15.8/83 (code 2).
 */
const WORKED = '# bench run 1, invented for the worked example\ncode,voltage\n0,0\n1,1\n2,2.1\n3,2.9\n4,4.2\n5,5\n6,5.8\n7,7\n'

describe('parseBenchCsv', () => {
  it('reads a header, comments and code order-free lines', () => {
    const r = parseBenchCsv('# meter: bench DMM\ncode;voltage (V)\n\n1;0.5\n0;0\n# middle comment\n3;1.5\n2;1.0\n', 2)
    expect(r).toEqual({ ok: true, value: { quantity: 'voltage', levels: [0, 0.5, 1, 1.5] } })
  })

  it('reads a file without a header, and a current column for a current output', () => {
    expect(parseBenchCsv('0,0\n1,1e-3\n2,2e-3\n3,3e-3', 2)).toMatchObject({ ok: true })
    expect(parseBenchCsv('code,current (A)\n0,0\n1,1e-6\n2,2e-6\n3,3e-6', 2, 'current')).toMatchObject({ ok: true, value: { quantity: 'current' } })
    expect(parseBenchCsv('code,current\n0,0\n1,1\n2,2\n3,3', 2, 'voltage')).toMatchObject({ ok: false, errors: [{ line: 1 }] })
  })

  it('reports every malformed line by its number', () => {
    const text = ['# comment', 'code,voltage', '0,0', '1,abc', ',0.5', '2,0.6', '2,0.61', '9,1', '3', 'x,1'].join('\n')
    const r = parseBenchCsv(text, 2)
    expect(r.ok).toBe(false)
    if (r.ok) return
    expect(r.errors).toEqual([
      { line: 4, message: 'the voltage of code 1 must be a number (got "abc")' },
      { line: 5, message: 'the code is missing' },
      { line: 7, message: 'code 2 appears again (first on line 6)' },
      { line: 8, message: 'code 9 is outside 0 to 3 of a 2-bit study' },
      { line: 9, message: 'the voltage of code 3 is missing' },
      { line: 10, message: 'the code must be a whole number from 0 to 3 (got "x")' }
    ])
  })

  it('refuses a file that does not cover 0 … 2^N − 1', () => {
    const r = parseBenchCsv('code,voltage\n0,0\n1,1\n2,2\n', 2)
    expect(r).toMatchObject({ ok: false, errors: [{ line: null, message: 'the file has 3 codes; a 2-bit study needs all 4 codes 0 to 3: code 3 missing' }] })
    expect(parseBenchCsv('code,voltage\n0,0\n1,1\n2,2\n3,3\n', 3)).toMatchObject({ ok: false, errors: [{ line: null }] })
  })

  it('refuses a bad header and a flat transfer', () => {
    expect(parseBenchCsv('when,where\n0,0\n1,1\n2,2\n3,3\n', 2)).toMatchObject({ ok: false, errors: [{ line: 1 }] })
    expect(parseBenchCsv('0,1\n1,1\n2,1\n3,1\n', 2)).toMatchObject({ ok: false, errors: [{ line: 4 }] })
  })
})

// Decimal commas with a semicolon or tab separator are how spreadsheets in much of Europe write
// CSV (common practice, no source); the expected levels are the same numbers written with points.
describe('parseBenchCsv: separators, decimal commas and one message per problem', () => {
  const levels = [0, 0.5, 1, 1.5]
  it('reads semicolon and tab files with decimal commas', () => {
    expect(parseBenchCsv('code;voltage\n0;0\n1;0,5\n2;1,0\n3;1,5\n', 2)).toEqual({ ok: true, value: { quantity: 'voltage', levels } })
    expect(parseBenchCsv('code\tvoltage\n0\t0\n1\t0,5\n2\t1\n3\t1,5\n', 2)).toEqual({ ok: true, value: { quantity: 'voltage', levels } })
    expect(parseBenchCsv('0;0\n1;5,0e-1\n2;1\n3;1,5\n', 2)).toEqual({ ok: true, value: { quantity: 'voltage', levels } })
  })

  it('says in one message which separator is expected when a comma file also has decimal commas', () => {
    const lines = Array.from({ length: 4096 }, (_, k) => `${k},${Math.floor(k / 1000)},${k % 1000}`)
    const r = parseBenchCsv(`code,voltage\n${lines.join('\n')}\n`, 12)
    expect(r.ok).toBe(false)
    if (r.ok) return
    expect(r.total).toBe(1)
    expect(r.errors).toEqual([{ line: null, message: expect.stringMatching(/decimal comma.*semicolon or a tab/) }])
  })

  it('folds a problem repeated on every line into one message with the lines as ranges', () => {
    const lines = Array.from({ length: 4096 }, (_, k) => `${k},n/a`)
    const r = parseBenchCsv(`code,voltage\n${lines.join('\n')}`, 12)
    expect(r.ok).toBe(false)
    if (r.ok) return
    expect(r.total).toBe(1)
    expect(r.errors[0]!.line).toBe(2)
    expect(r.errors[0]!.message).toMatch(/^the voltage of code 0 must be a number \(got "n\/a"\); the same on 4095 more lines \(lines 3–4097\)$/)
  })

  it('lists missing codes by number as ranges', () => {
    const present = Array.from({ length: 16 }, (_, k) => k).filter(k => !(k >= 3 && k <= 6) && k !== 9)
    const r = parseBenchCsv(present.map(k => `${k},${k}`).join('\n'), 4)
    expect(r).toMatchObject({ ok: false, errors: [{ line: null, message: 'the file has 11 codes; a 4-bit study needs all 16 codes 0 to 15: codes 3–6, 9 missing' }] })
  })

  it('writes code ranges (derived)', () => {
    expect(codeRanges([12, 13, 14, 40, 77, 78])).toBe('12–14, 40, 77–78')
    expect(codeRanges([1, 3, 5], 2)).toBe('1, 3 and 1 more ranges')
    expect(codeRanges([])).toBe('')
  })
})

describe('benchSummary (hand-worked example, IEEE Std 1658 definitions in MODELS.md §1)', () => {
  const r = parseBenchCsv(WORKED, 3)
  if (!r.ok) throw new Error('worked example must parse')
  const s = benchSummary(r.value.levels)
  it('endpoint INL and DNL', () => {
    expect(s.endpoint.inlMaxLsb).toBeCloseTo(0.2, 12)
    expect(s.endpoint.inlMaxCode).toBe(4)
    expect(s.endpoint.inlMinLsb).toBeCloseTo(-0.2, 12)
    expect(s.endpoint.inlMinCode).toBe(6)
    expect(s.endpoint.dnlMaxLsb).toBeCloseTo(0.3, 12)
    expect(s.endpoint.dnlMaxCode).toBe(3)
    expect(s.endpoint.dnlMinLsb).toBeCloseTo(-0.2, 12)
    expect(s.endpoint.dnlMinCode).toBe(2)
    expect(s.monotonic).toBe(true)
  })
  it('best-fit INL and DNL', () => {
    expect(s.bestFit.inlMaxLsb).toBeCloseTo(17.3 / 83, 12)
    expect(s.bestFit.inlMaxCode).toBe(4)
    expect(s.bestFit.inlMinLsb).toBeCloseTo(-14.3 / 83, 12)
    expect(s.bestFit.inlMinCode).toBe(6)
    expect(s.bestFit.dnlMaxLsb).toBeCloseTo(26.2 / 83, 12)
    expect(s.bestFit.dnlMinLsb).toBeCloseTo(-15.8 / 83, 12)
    expect(s.bestFit.inlAbsLsb).toBeCloseTo(17.3 / 83, 12)
  })
  it('calls a transfer with a falling step non-monotonic (DNL ≤ −1, MODELS.md §1)', () => {
    expect(benchSummary([0, 1, 0.9, 3]).monotonic).toBe(false)
  })
})
