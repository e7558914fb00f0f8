/**
 * Seeded random numbers for the engine.
 *
 * Two generators, both reproducible from a seed:
 * - the reference path, `createNormalSource`: the stdlib improved ziggurat (Doornik 2005) over
 *   MT19937, a well-known seedable package; used where speed does not matter (sample netlists,
 *   cross-checks);
 * - the fast path, `createFastNormals`: a 128-layer ziggurat over xoshiro128** (see ziggurat.ts),
 *   about an order of magnitude faster, used by the Monte Carlo drivers so that 16-bit strings
 *   and highly segmented ladders (2^16 normals per trial) fit the evaluation time budget.
 * Both are checked statistically in tests/unit/shared/core/rng.spec.ts.
 */
import randn from '@stdlib/random-base-randn'
import { deriveSeed } from './seed'
import { FastNormalGenerator } from './ziggurat'

export { deriveSeed, splitMix64Words } from './seed'
export { FastNormalGenerator } from './ziggurat'

/** A function returning one standard normal deviate per call. */
export type NormalSource = () => number

/** Maps any safe-integer seed onto MT19937's seed range [1, 2^32 − 1] (deterministically). */
export function toMt19937Seed(seed: number): number {
  return deriveSeed(seed)
}

/**
 * Seeded standard normal source (reference path: stdlib improved ziggurat over MT19937).
 * @param seed any safe integer; equal seeds give equal sequences
 */
export function createNormalSource(seed: number): NormalSource {
  const rand = randn.factory({ seed: toMt19937Seed(seed), name: 'improved-ziggurat' })
  return () => rand()
}

/**
 * Seeded fast generator of standard normals with a bulk `fill(out, start?, end?)`.
 * @param seed any safe integer; equal seeds give equal sequences
 */
export function createFastNormals(seed: number): FastNormalGenerator {
  return new FastNormalGenerator(seed)
}

/**
 * Fast-path `NormalSource` (one deviate per call) for code that wants a plain function. It owns
 * its generator and hands out values of bulk fills one by one: the same sequence as `next()`
 * calls (fill continues the stream), without a fill call per value (a 16-bit string sample
 * draws 2^16 of them).
 */
export function createFastNormalSource(seed: number): NormalSource {
  const gen = new FastNormalGenerator(seed)
  const block = new Float64Array(NORMAL_SOURCE_BLOCK)
  let at = block.length
  return () => {
    if (at === block.length) {
      gen.fill(block, 0, block.length)
      at = 0
    }
    return block[at++]!
  }
}

/** Values drawn per refill of a fast normal source. */
const NORMAL_SOURCE_BLOCK = 512
