import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { decimateMinMax, logOrNull, seriesExtremes } from '../../../utils/chartSeries'

const series = fc.integer({ min: 1, max: 2000 }).chain(n => fc.record({
  codes: fc.constant(Array.from({ length: n }, (_, i) => i * 4)),
  min: fc.array(fc.option(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { nil: null }), { minLength: n, maxLength: n }),
  max: fc.array(fc.option(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { nil: null }), { minLength: n, maxLength: n })
}))

describe('decimateMinMax', () => {
  it('never draws more than the point budget and keeps the lowest and highest value and where they are', () => {
    fc.assert(fc.property(series, fc.integer({ min: 8, max: 300 }), (s, budget) => {
      const d = decimateMinMax(s, budget)
      expect(d.codes.length).toBeLessThanOrEqual(budget)
      const before = seriesExtremes(s)
      const after = seriesExtremes(d)
      // Min/max decimation keeps extremes exactly (derived: min of mins, max of maxes).
      expect(after.min).toBe(before.min)
      expect(after.max).toBe(before.max)
      // The bucket holding an extreme starts at or before the code where it was.
      if (before.minCode !== null) expect(after.minCode!).toBeLessThanOrEqual(before.minCode)
    }))
  })

  it('leaves a series within the budget as it is', () => {
    const s = { codes: [0, 1, 2], min: [1, null, -2], max: [3, null, 0] }
    expect(decimateMinMax(s, 4)).toBe(s)
  })

  it('merges whole buckets: 8 codes into 4 points of 2 codes each', () => {
    const s = { codes: [0, 1, 2, 3, 4, 5, 6, 7], min: [5, 1, 7, null, 2, 3, 9, 8], max: [6, 2, 8, null, 4, 3, 9, 10] }
    // Worked by hand (derived): each pair's lowest min and highest max, starting at its first code.
    expect(decimateMinMax(s, 4)).toEqual({ codes: [0, 2, 4, 6], min: [1, 7, 2, 8], max: [6, 8, 4, 10] })
  })
})

describe('logOrNull', () => {
  it('plots decades and leaves a gap where a logarithm has no value', () => {
    expect(logOrNull(1e-12)).toBeCloseTo(-12, 12)
    expect([logOrNull(0), logOrNull(-1), logOrNull(null)]).toEqual([null, null, null])
  })
})
