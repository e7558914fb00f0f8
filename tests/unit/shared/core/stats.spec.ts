import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { decimateSeries } from '#shared/core/stats/envelope'
import { wilsonInterval } from '#shared/core/stats/interval'
import { kolmogorovCdf, kolmogorovQuantile } from '#shared/core/stats/kolmogorov'
import { normalCdf, normalQuantile, normalUpperTail } from '#shared/core/stats/normal'
import { createTally, mergeTally } from '#shared/core/stats/accumulator'

describe('normal distribution', () => {
  it('matches tabulated Φ values (standard normal tables, 15 digits from memory)', () => {
    expect(normalCdf(0)).toBe(0.5)
    expect(normalCdf(1)).toBeCloseTo(0.841344746068543, 14)
    expect(normalCdf(1.96)).toBeCloseTo(0.97500210485178, 13)
    expect(normalCdf(-2.5)).toBeCloseTo(0.00620966532577613, 15)
  })
  it('keeps relative accuracy in the far tail: Q(5) = 2.8665157e-7, Q(10) = 7.6198530e-24 (from memory)', () => {
    expect(normalUpperTail(5) / 2.866515718791939e-7 - 1).toBeLessThan(1e-9)
    expect(Math.abs(normalUpperTail(10) / 7.619853024160527e-24 - 1)).toBeLessThan(1e-9)
  })
  it('inverts the stdlib quantile: Φ(Φ⁻¹(p)) = p', () => {
    fc.assert(fc.property(fc.double({ min: 1e-12, max: 1 - 1e-12, noNaN: true }), (p) => {
      expect(Math.abs(normalCdf(normalQuantile(p)) - p)).toBeLessThan(1e-12 + 1e-9 * p)
    }))
  })
})

describe('Kolmogorov distribution', () => {
  it('has continuous series forms at x = 1 and inverts its quantile', () => {
    expect(kolmogorovCdf(1 - 1e-12)).toBeCloseTo(kolmogorovCdf(1), 10)
    expect(kolmogorovCdf(1)).toBeCloseTo(0.730000328322645, 10)
    fc.assert(fc.property(fc.double({ min: 0.01, max: 0.999999, noNaN: true }), (y) => {
      expect(kolmogorovCdf(kolmogorovQuantile(y))).toBeCloseTo(y, 9)
    }))
  })
})

describe('Wilson score interval', () => {
  it('gives the textbook intervals 5/10 → [0.2366, 0.7634] and 0/10 → [0, 0.2775] at 95 % (computed by hand)', () => {
    const a = wilsonInterval(5, 10)
    expect(a.low).toBeCloseTo(0.2366, 4)
    expect(a.high).toBeCloseTo(0.7634, 4)
    const b = wilsonInterval(0, 10)
    expect(b.low).toBe(0)
    expect(b.high).toBeCloseTo(0.2775, 4)
  })
  it('always brackets the estimate within [0, 1]', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 1e6 }), fc.double({ min: 0, max: 1, noNaN: true }), (n, f) => {
      const k = Math.round(f * n)
      const ci = wilsonInterval(k, n)
      expect(ci.low).toBeLessThanOrEqual(k / n)
      expect(ci.high).toBeGreaterThanOrEqual(k / n)
      expect(ci.low).toBeGreaterThanOrEqual(0)
      expect(ci.high).toBeLessThanOrEqual(1)
    }))
  })
})

describe('decimation and tallies', () => {
  it('keeps every bucket extreme of a series and skips infinities', () => {
    fc.assert(fc.property(fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 3000 }), fc.integer({ min: 1, max: 300 }), (xs, points) => {
      const d = decimateSeries(xs, points)
      expect(d.codes.length).toBeLessThanOrEqual(points)
      expect(Math.max(...d.max.map(v => v ?? -Infinity))).toBe(Math.max(...xs))
      expect(Math.min(...d.min.map(v => v ?? Infinity))).toBe(Math.min(...xs))
    }))
    expect(decimateSeries([Infinity, 1, 2, 3], 2).min).toEqual([1, 2])
  })
  it('merges tallies associatively', () => {
    const t = (trials: number, worst: number) => ({ ...createTally(4), trials, inlPass: trials - 1, worstInlLsb: worst, worstInlCode: trials })
    const [a, b, c] = [t(3, 0.2), t(5, 0.9), t(7, 0.4)]
    expect(mergeTally(mergeTally(a, b), c)).toEqual(mergeTally(a, mergeTally(b, c)))
    expect(mergeTally(mergeTally(a, b), c).worstInlCode).toBe(5)
  })
})
