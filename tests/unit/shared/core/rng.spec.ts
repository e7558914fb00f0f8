import { describe, expect, it } from 'vitest'
import { createFastNormals, createFastNormalSource, createNormalSource, deriveSeed } from '#shared/core/stats/rng'
import { normalCdf } from '#shared/core/stats/normal'

/** One-sample Kolmogorov–Smirnov statistic D_n of samples against Φ. */
function ksStatistic(samples: Float64Array): number {
  const sorted = Float64Array.from(samples).sort()
  const n = sorted.length
  let d = 0
  for (let i = 0; i < n; i++) {
    const f = normalCdf(sorted[i]!)
    d = Math.max(d, (i + 1) / n - f, f - i / n)
  }
  return d
}

function moments(x: Float64Array): { mean: number, variance: number, skew: number, kurt: number } {
  const n = x.length
  let s1 = 0
  let s2 = 0
  let s3 = 0
  let s4 = 0
  for (const v of x) {
    s1 += v
    s2 += v * v
    s3 += v * v * v
    s4 += v * v * v * v
  }
  return { mean: s1 / n, variance: s2 / n, skew: s3 / n, kurt: s4 / n }
}

function draw(source: () => number, n: number): Float64Array {
  const out = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    out[i] = source()
  }
  return out
}

// KS critical value at alpha = 0.001 is 1.949/sqrt(n) (asymptotic Kolmogorov quantile, from memory).
const KS_CRIT_001 = 1.949

describe('fast ziggurat normals (xoshiro128** + Marsaglia–Tsang layers)', () => {
  it('has standard normal moments within 5 standard errors over 10^6 samples', () => {
    const n = 1_000_000
    const x = new Float64Array(n)
    createFastNormals(7).fill(x)
    const m = moments(x)
    // standard errors of the raw moments of N(0,1): sqrt(1/n), sqrt(2/n), sqrt(15/n), sqrt(96/n) (standard results)
    expect(Math.abs(m.mean)).toBeLessThan(5 * Math.sqrt(1 / n))
    expect(Math.abs(m.variance - 1)).toBeLessThan(5 * Math.sqrt(2 / n))
    expect(Math.abs(m.skew)).toBeLessThan(5 * Math.sqrt(15 / n))
    expect(Math.abs(m.kurt - 3)).toBeLessThan(5 * Math.sqrt(96 / n))
  })

  it('passes a Kolmogorov–Smirnov test against Φ at the 0.1 % level for several seeds', () => {
    const n = 200_000
    for (const seed of [1, 2, 12345]) {
      const x = new Float64Array(n)
      createFastNormals(seed).fill(x)
      expect(ksStatistic(x)).toBeLessThan(KS_CRIT_001 / Math.sqrt(n))
    }
  })

  it('puts the right mass beyond the ziggurat base (|x| > 3.4426) so the tail sampler works', () => {
    const n = 2_000_000
    const x = new Float64Array(n)
    createFastNormals(99).fill(x)
    let beyond = 0
    for (const v of x) {
      beyond += Math.abs(v) > 3.442619855899 ? 1 : 0
    }
    const p = 2 * normalCdf(-3.442619855899)
    // binomial count: mean n p, sd sqrt(n p (1 − p)); allow 5 sd
    expect(Math.abs(beyond - n * p)).toBeLessThan(5 * Math.sqrt(n * p * (1 - p)))
  })

  it('fill() gives exactly the sequence of next() calls and is reproducible from the seed', () => {
    const a = new Float64Array(50_000)
    createFastNormals(42).fill(a)
    const b = draw(createFastNormalSource(42), 50_000)
    expect(Array.from(a)).toEqual(Array.from(b))
    const c = new Float64Array(50_000)
    const g = createFastNormals(42)
    g.fill(c, 0, 20_000)
    g.fill(c, 20_000)
    expect(Array.from(c)).toEqual(Array.from(a))
    const d = new Float64Array(1000)
    createFastNormals(43).fill(d)
    expect(Array.from(d)).not.toEqual(Array.from(a.subarray(0, 1000)))
  })

  it('has lag-1 autocorrelation within 5 standard errors of zero', () => {
    const n = 500_000
    const x = new Float64Array(n)
    createFastNormals(3).fill(x)
    let s = 0
    for (let i = 1; i < n; i++) {
      s += x[i]! * x[i - 1]!
    }
    expect(Math.abs(s / n)).toBeLessThan(5 / Math.sqrt(n))
  })
})

describe('reference normals (stdlib improved ziggurat over MT19937)', () => {
  it('is reproducible from the seed and passes the KS test', () => {
    const a = draw(createNormalSource(5), 100_000)
    const b = draw(createNormalSource(5), 100_000)
    expect(Array.from(a.subarray(0, 100))).toEqual(Array.from(b.subarray(0, 100)))
    expect(ksStatistic(a)).toBeLessThan(KS_CRIT_001 / Math.sqrt(a.length))
  })

  it('accepts seed 0 and negative seeds (mapped into the MT19937 seed range)', () => {
    expect(Number.isFinite(createNormalSource(0)())).toBe(true)
    expect(Number.isFinite(createNormalSource(-3)())).toBe(true)
  })
})

describe('deriveSeed', () => {
  it('is deterministic, order-sensitive and spreads nearby keys', () => {
    expect(deriveSeed(1, 2, 3)).toBe(deriveSeed(1, 2, 3))
    expect(deriveSeed(1, 2, 3)).not.toBe(deriveSeed(1, 3, 2))
    const seen = new Set<number>()
    for (let k = 0; k < 1000; k++) {
      seen.add(deriveSeed(1, k))
    }
    expect(seen.size).toBe(1000)
  })
})
