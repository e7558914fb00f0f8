import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { solveCircuitArrays } from '#shared/core/solve/index'
import { createSampler } from '#shared/core/models/samplers'
import { candidateShapes } from '#shared/core/models/shapes'
import { linearityFromLevels, newLinearityResult } from '#shared/core/stats/linearity'

const ALL = ['string', 'r2r-voltage', 'r2r-current', 'segmented', 'two-stage-string'] as const

/** Element values a sampler draws from z (same mapping as samplers.ts, written out independently). */
const unit = (z: number[], i: number, s: number) => 1 + s * z[i]!
const twoR = (z: number[], i: number, s: number) => 2 * (1 + (s / Math.SQRT2) * z[i]!)

describe('Monte Carlo samplers equal the exact nodal solve of the same sample on every code', () => {
  it('segmented (fused unary weights) and R-2R with switch resistance, endpoint and best-fit', () => {
    fc.assert(fc.property(
      fc.integer({ min: 3, max: 8 }),
      fc.integer({ min: 0, max: 7 }),
      fc.array(fc.double({ min: -3, max: 3, noNaN: true }), { minLength: 300, maxLength: 300 }),
      fc.double({ min: 0, max: 0.05, noNaN: true }),
      fc.constantFrom('endpoint' as const, 'best-fit' as const),
      (bits, mPick, z, sw, def) => {
        const sigma = 0.01
        const shapes = candidateShapes(bits, ALL)
        const m = 1 + (mPick % (bits - 1))
        const seg = shapes.find(s => s.id === `segmented-m${m}`)!
        const l = bits - m
        const legs = 2 ** m - 1
        const circuit = {
          topology: 'segmented' as const, bits, vrefV: 1, unaryBits: m, switchOhm: sw,
          unaryLegsOhm: Array.from({ length: legs }, (_, j) => twoR(z, j, sigma)),
          jointOhm: unit(z, legs, sigma),
          legsOhm: Array.from({ length: l }, (_, i) => twoR(z, legs + 1 + i, sigma)),
          seriesOhm: Array.from({ length: l - 1 }, (_, i) => unit(z, legs + 1 + l + i, sigma)),
          terminationOhm: twoR(z, legs + 2 * l, sigma)
        }
        const exact = linearityFromLevels(solveCircuitArrays(circuit).value, def, newLinearityResult())
        const fast = newLinearityResult()
        createSampler(seg, { sigmaUnit: sigma, switchRatio: sw, twoR: 'two-units', offsetSigma: 0, def }).run(Float64Array.from(z), fast)
        expect(fast.inlMaxLsb).toBeCloseTo(exact.inlMaxLsb, 8)
        expect(fast.inlMinLsb).toBeCloseTo(exact.inlMinLsb, 8)
        expect(fast.dnlMaxLsb).toBeCloseTo(exact.dnlMaxLsb, 8)
        expect(fast.dnlMinLsb).toBeCloseTo(exact.dnlMinLsb, 8)
        const ladder = {
          topology: 'r2r-voltage' as const, bits, vrefV: 1, switchOhm: sw,
          legsOhm: Array.from({ length: bits }, (_, i) => twoR(z, i, sigma)),
          seriesOhm: Array.from({ length: bits - 1 }, (_, i) => unit(z, bits + i, sigma)),
          terminationOhm: twoR(z, 2 * bits - 1, sigma)
        }
        const exactLadder = linearityFromLevels(solveCircuitArrays(ladder).value, def, newLinearityResult())
        const fastLadder = newLinearityResult()
        createSampler(shapes.find(s => s.id === 'r2r-voltage')!, { sigmaUnit: sigma, switchRatio: sw, twoR: 'two-units', offsetSigma: 0, def }).run(Float64Array.from(z), fastLadder)
        expect(fastLadder.inlMaxLsb).toBeCloseTo(exactLadder.inlMaxLsb, 8)
        expect(fastLadder.dnlMinLsb).toBeCloseTo(exactLadder.dnlMinLsb, 8)
      }
    ), { numRuns: 60 })
  })

  it('shares one computation between the direct and tree strings (same circuit when unloaded)', () => {
    const shapes = candidateShapes(8, ['string'])
    const p = { sigmaUnit: 0.01, switchRatio: 0.01, twoR: 'two-units' as const, offsetSigma: 0, def: 'endpoint' as const }
    expect(createSampler(shapes[0]!, p).key).toBe(createSampler(shapes[1]!, p).key)
  })
})
