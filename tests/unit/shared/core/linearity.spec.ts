import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import type { InlDefinition } from '#shared/core/stats/linearity'
import { linearityFromBinaryWeights, linearityFromLevels, newLinearityResult } from '#shared/core/stats/linearity'
import { createSegmentedScratch, linearityFromSegmentedWeights } from '#shared/core/stats/segmented'
import { createEnvelope } from '#shared/core/stats/envelope'

/** Brute force: the level of every code of a binary-weighted curve. */
function binaryLevels(w: number[], offset: number): Float64Array {
  const nb = w.length
  const out = new Float64Array(2 ** nb)
  for (let k = 0; k < out.length; k++) {
    let v = offset
    for (let i = 0; i < nb; i++) {
      v += (k >> (nb - 1 - i)) & 1 ? w[i]! : 0
    }
    out[k] = v
  }
  return out
}

/** Brute force: the level of every code of a segmented curve (m = k >> L legs on). */
function segmentedLevels(u: number[], w: number[], offset: number): Float64Array {
  const L = w.length
  const bin = binaryLevels(w, 0)
  const out = new Float64Array((u.length + 1) * 2 ** L)
  let cum = offset
  for (let m = 0; m <= u.length; m++) {
    for (let c = 0; c < 2 ** L; c++) {
      out[m * 2 ** L + c] = cum + bin[c]!
    }
    cum += m < u.length ? u[m]! : 0
  }
  return out
}

const perturbed = (ideal: number[], errs: number[]) => ideal.map((v, i) => v * (1 + errs[i]!))
const defs: InlDefinition[] = ['endpoint', 'best-fit']

describe('INL/DNL from weights agrees with enumerating every code (brute force, small N)', () => {
  it('binary weights: O(N) extremes equal the per-code extremes', () => {
    fc.assert(fc.property(
      fc.integer({ min: 2, max: 9 }),
      fc.array(fc.double({ min: -0.05, max: 0.05, noNaN: true }), { minLength: 9, maxLength: 9 }),
      fc.double({ min: -0.01, max: 0.01, noNaN: true }),
      (nb, errs, offset) => {
        const w = perturbed(Array.from({ length: nb }, (_, i) => 2 ** -(i + 1)), errs)
        for (const def of defs) {
          const fast = linearityFromBinaryWeights(w, offset, def, newLinearityResult())
          const slow = linearityFromLevels(binaryLevels(w, offset), def, newLinearityResult())
          expect(fast.inlMaxLsb).toBeCloseTo(slow.inlMaxLsb, 9)
          expect(fast.inlMinLsb).toBeCloseTo(slow.inlMinLsb, 9)
          expect(fast.dnlMaxLsb).toBeCloseTo(slow.dnlMaxLsb, 9)
          expect(fast.dnlMinLsb).toBeCloseTo(slow.dnlMinLsb, 9)
          const levels = binaryLevels(w, offset)
          // the reported worst code really attains the extreme (ties allowed)
          const atMax = linearityFromLevels(levels, def, newLinearityResult())
          expect(atMax.inlMaxLsb).toBeCloseTo(fast.inlMaxLsb, 9)
        }
      }
    ), { numRuns: 150 })
  })

  it('segmented weights: O(2^M + L) extremes and envelopes equal the per-code ones', () => {
    fc.assert(fc.property(
      fc.integer({ min: 1, max: 4 }),
      fc.integer({ min: 1, max: 5 }),
      fc.array(fc.double({ min: -0.05, max: 0.05, noNaN: true }), { minLength: 40, maxLength: 40 }),
      fc.integer({ min: 1, max: 5 }),
      (M, L, errs, pointBits) => {
        const legs = 2 ** M - 1
        const u = perturbed(Array.from({ length: legs }, () => 2 ** -M), errs.slice(0, legs))
        const w = perturbed(Array.from({ length: L }, (_, i) => 2 ** -(M + i + 1)), errs.slice(20, 20 + L))
        for (const def of defs) {
          const envFast = createEnvelope(M + L, 2 ** pointBits)
          const envSlow = createEnvelope(M + L, 2 ** pointBits)
          const fast = linearityFromSegmentedWeights(u, w, 0, def, newLinearityResult(), createSegmentedScratch(M, 64), envFast)
          const slow = linearityFromLevels(segmentedLevels(u, w, 0), def, newLinearityResult(), envSlow)
          expect(fast.inlMaxLsb).toBeCloseTo(slow.inlMaxLsb, 9)
          expect(fast.inlMinLsb).toBeCloseTo(slow.inlMinLsb, 9)
          expect(fast.dnlMaxLsb).toBeCloseTo(slow.dnlMaxLsb, 9)
          expect(fast.dnlMinLsb).toBeCloseTo(slow.dnlMinLsb, 9)
          for (let b = 0; b < envFast.min.length; b++) {
            expect(envFast.min[b]!).toBeCloseTo(envSlow.min[b]!, 9)
            expect(envFast.max[b]!).toBeCloseTo(envSlow.max[b]!, 9)
          }
        }
      }
    ), { numRuns: 150 })
  })

  it('endpoint INL is zero at both end codes and DNL sums to zero (definition, MODELS.md §1)', () => {
    const levels = Float64Array.from([0, 1.1, 1.9, 3.2, 4.05, 4.9, 6.1, 7])
    const r = linearityFromLevels(levels, 'endpoint', newLinearityResult())
    expect(r.inlMaxLsb).toBeCloseTo(0.2, 12)
    expect(r.inlMinLsb).toBeCloseTo(-0.1, 12)
    expect(r.dnlMaxLsb).toBeCloseTo(0.3, 12)
    expect(r.dnlMinLsb).toBeCloseTo(-0.2, 12)
  })
})
