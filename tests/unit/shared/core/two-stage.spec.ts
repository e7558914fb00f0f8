import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { solveCircuitArrays } from '#shared/core/solve/index'
import { linearityFromLevels, newLinearityResult } from '#shared/core/stats/linearity'
import { createTwoStageScratch, twoStageTrial } from '#shared/core/stats/two-stage'
import { createEnvelope } from '#shared/core/stats/envelope'
import { stringTrial } from '#shared/core/stats/string-mc'

describe('two-stage string INL/DNL via convex hulls equals enumerating every code (exact nodal solver)', () => {
  it('matches per-code extremes and envelopes for random samples, both buffering options and INL lines', () => {
    fc.assert(fc.property(
      fc.integer({ min: 1, max: 4 }),
      fc.integer({ min: 1, max: 4 }),
      fc.array(fc.double({ min: -0.2, max: 0.2, noNaN: true }), { minLength: 32, maxLength: 32 }),
      fc.boolean(),
      fc.constantFrom('endpoint' as const, 'best-fit' as const),
      fc.integer({ min: 0, max: 8 }),
      (M, L, errs, buffered, def, pointBits) => {
        const coarse = Array.from({ length: 2 ** M }, (_, i) => (buffered ? 1 : 0.05) * (1 + errs[i]!))
        const fine = Array.from({ length: 2 ** L }, (_, i) => 1 + errs[16 + i]!)
        const levels = solveCircuitArrays({ topology: 'two-stage-string', bits: M + L, vrefV: 1, coarseBits: M, coarseOhm: coarse, fineOhm: fine, buffered }).value
        const envSlow = createEnvelope(M + L, 2 ** pointBits)
        const envFast = createEnvelope(M + L, 2 ** pointBits)
        const slow = linearityFromLevels(levels, def, newLinearityResult(), envSlow)
        const fast = twoStageTrial({ coarse, fine, buffered, offsetLo: 0, offsetHi: 0 }, def, newLinearityResult(), createTwoStageScratch(M, L), envFast)
        expect(fast.inlMaxLsb).toBeCloseTo(slow.inlMaxLsb, 8)
        expect(fast.inlMinLsb).toBeCloseTo(slow.inlMinLsb, 8)
        expect(fast.dnlMaxLsb).toBeCloseTo(slow.dnlMaxLsb, 8)
        expect(fast.dnlMinLsb).toBeCloseTo(slow.dnlMinLsb, 8)
        for (let b = 0; b < envFast.min.length; b++) {
          expect(envFast.min[b]!).toBeCloseTo(envSlow.min[b]!, 8)
          expect(envFast.max[b]!).toBeCloseTo(envSlow.max[b]!, 8)
        }
      }
    ), { numRuns: 200 })
  })
})

describe('string trial from unit normals equals the per-code extraction', () => {
  it('gives the same INL/DNL extremes and envelope as linearityFromLevels on the tap levels', () => {
    fc.assert(fc.property(
      fc.integer({ min: 2, max: 9 }),
      fc.array(fc.double({ min: -3, max: 3, noNaN: true }), { minLength: 512, maxLength: 512 }),
      fc.constantFrom('endpoint' as const, 'best-fit' as const),
      (N, zs, def) => {
        const n = 2 ** N
        const z = Float64Array.from(zs.slice(0, n))
        const sigma = 0.02
        const units = Array.from(z, v => 1 + sigma * v)
        const levels = solveCircuitArrays({ topology: 'string', bits: N, vrefV: 1, unitsOhm: units }).value
        const envSlow = createEnvelope(N, 16)
        const envFast = createEnvelope(N, 16)
        const slow = linearityFromLevels(levels, def, newLinearityResult(), envSlow)
        const fast = stringTrial(z, n, sigma, def, newLinearityResult(), envFast)
        expect(fast.inlMaxLsb).toBeCloseTo(slow.inlMaxLsb, 9)
        expect(fast.inlMinLsb).toBeCloseTo(slow.inlMinLsb, 9)
        expect(fast.dnlMaxLsb).toBeCloseTo(slow.dnlMaxLsb, 9)
        expect(fast.dnlMinLsb).toBeCloseTo(slow.dnlMinLsb, 9)
        for (let b = 0; b < envFast.min.length; b++) {
          expect(envFast.min[b]!).toBeCloseTo(envSlow.min[b]!, 9)
          expect(envFast.max[b]!).toBeCloseTo(envSlow.max[b]!, 9)
        }
      }
    ), { numRuns: 100 })
  })
})
