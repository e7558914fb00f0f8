/**
 * Monte Carlo against the analytic models (property tests with fast-check) and against the
 * exact nodal solver. Tolerances are stated per check: a 99.9 % Wilson interval plus the known
 * first-order model error (discrete strings have a smaller supremum than the continuous bridge).
 */
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { analyticDnlYield, analyticInlYield, sigmaForInl } from '#shared/core/models/matching'
import { createSampler } from '#shared/core/models/samplers'
import type { SamplerParams } from '#shared/core/models/samplers'
import { candidateShapes } from '#shared/core/models/shapes'
import type { CandidateShape } from '#shared/core/models/shapes'
import { wilsonInterval } from '#shared/core/stats/interval'
import { runMonteCarloChunk } from '#shared/core/stats/montecarlo'

const ALL = ['string', 'r2r-voltage', 'r2r-current', 'segmented', 'two-stage-string'] as const
const shapeOf = (bits: number, id: string): CandidateShape => candidateShapes(bits, ALL).find(s => s.id === id)!
const params = (sigmaUnit: number, extra: Partial<SamplerParams> = {}): SamplerParams => ({ sigmaUnit, switchRatio: 0, twoR: 'two-units', offsetSigma: 0, def: 'endpoint', ...extra })

function mcYield(shape: CandidateShape, p: SamplerParams, trials: number, seed: number, inlT: number, dnlT: number) {
  const [t] = runMonteCarloChunk({ seed, chunkIndex: 0, trials, bits: shape.bits, envelopePoints: 16, envelope: true, targets: { inlTargetLsb: inlT, dnlTargetLsb: dnlT, monotonicRequired: false } }, [createSampler(shape, p)])
  return t!
}

describe('Monte Carlo yield agrees with the analytic yield within its confidence interval', () => {
  it('string INL yield ≈ K((T + 0.5826 σ_u)/(σ_u √2^N)) (discretely sampled Brownian bridge; 99.9 % CI + 0.01)', () => {
    fc.assert(fc.property(
      fc.integer({ min: 6, max: 9 }),
      fc.double({ min: 0.5, max: 0.99, noNaN: true }),
      fc.integer({ min: 1, max: 1e6 }),
      (bits, target, seed) => {
        const shape = shapeOf(bits, 'string-direct')
        const sigma = sigmaForInl(shape, 'two-units', 0.5, target)
        const t = mcYield(shape, params(sigma), 1500, seed, 0.5, 10)
        const ci = wilsonInterval(t.inlPass, t.trials, 0.999)
        const analytic = analyticInlYield(shape, 'two-units', sigma, 0.5)
        // the uncorrected sizing bound is conservative: the predicted yield is at least the target
        expect(analytic).toBeGreaterThanOrEqual(target)
        expect(analytic).toBeGreaterThanOrEqual(ci.low - 0.01)
        expect(analytic).toBeLessThanOrEqual(ci.high + 0.01)
      }
    ), { numRuns: 6 })
  })

  it('R-2R DNL yield ≈ 2Φ(T/σ_DNL,mid) − 1 with σ_DNL,mid = √0.8·2^(N−1)·σ_u at high yields (99.9 % CI + 0.01 for the minor steps)', () => {
    fc.assert(fc.property(
      fc.integer({ min: 8, max: 12 }),
      fc.double({ min: 0.9, max: 0.995, noNaN: true }),
      fc.integer({ min: 1, max: 1e6 }),
      (bits, target, seed) => {
        const shape = shapeOf(bits, 'r2r-voltage')
        // σ_u that gives the target midscale DNL yield at 0.5 LSB
        const sigma = 0.5 / (Math.sqrt(0.8) * 2 ** (bits - 1) * (-normalInv((1 - target) / 2)))
        const t = mcYield(shape, params(sigma), 2000, seed, 100, 0.5)
        const ci = wilsonInterval(t.dnlPass, t.trials, 0.999)
        const analytic = analyticDnlYield(shape, 'two-units', sigma, 0.5)
        expect(analytic).toBeGreaterThanOrEqual(ci.low - 0.01)
        expect(analytic).toBeLessThanOrEqual(ci.high + 0.01)
      }
    ), { numRuns: 6 })
  })

  it('CV15: the 10-bit string sized by the bridge bound (0.8666 %) yields 0.998 ± 0.001 in Monte Carlo (D)', () => {
    const shape = shapeOf(10, 'string-direct')
    const t = mcYield(shape, params(0.008666), 20000, 7, 0.5, 10)
    expect(Math.abs(t.inlPass / t.trials - 0.998)).toBeLessThanOrEqual(0.0015)
  })

  it('CV17: the 10-bit R-2R sized for 99.7 % DNL yield (σ_u = 0.03679 %) yields 0.997 ± 0.001 in Monte Carlo (D)', () => {
    const shape = shapeOf(10, 'r2r-voltage')
    const t = mcYield(shape, params(0.0003679), 30000, 11, 100, 0.5)
    expect(Math.abs(t.dnlPass / t.trials - 0.997)).toBeLessThanOrEqual(0.0015)
  })

  it('10-bit string: mean |INL|max / (σ_u·√2^N) is near E sup|Brownian bridge| = √(π/2)·ln 2 = 0.8687 (M; −5 %/+2 %)', () => {
    const shape = shapeOf(10, 'string-direct')
    const t = mcYield(shape, params(0.001), 3000, 3, 10, 10)
    // E[sup|Brownian bridge|] = √(π/2)·ln 2 ≈ 0.8687 (from memory); the discrete 1024-point string sits slightly below
    expect(t.inlSum / t.trials / (0.001 * 32)).toBeGreaterThan(0.8687 * 0.95)
    expect(t.inlSum / t.trials / (0.001 * 32)).toBeLessThan(0.8687 * 1.02)
  })
})

/** Inverse of Φ by bisection on erf-free Φ (kept local so the check does not reuse the engine's quantile). */
function normalInv(p: number): number {
  let lo = -10
  let hi = 10
  for (let i = 0; i < 100; i++) {
    const mid = (lo + hi) / 2
    if (phi(mid) < p) {
      lo = mid
    } else {
      hi = mid
    }
  }
  return (lo + hi) / 2
}

/** Φ by Simpson integration of the density (independent of the engine's series). */
function phi(x: number): number {
  const a = -12
  const n = 4000
  const h = (x - a) / n
  let s = 0
  for (let i = 0; i <= n; i++) {
    const t = a + i * h
    const w = i === 0 || i === n ? 1 : i % 2 ? 4 : 2
    s += w * Math.exp(-0.5 * t * t)
  }
  return (s * h) / 3 / Math.sqrt(2 * Math.PI)
}
