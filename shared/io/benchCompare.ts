/**
 * What the bench view charts: the measured INL and the nominal prediction, each reduced to the
 * same aligned code buckets as the Monte Carlo envelope (lowest and highest INL per bucket), by
 * the engine's own extraction (`linearityFromLevels` widening an `Envelope`).
 */
import type { InlDefinition } from '../core/stats/linearity'
import { linearityFromLevels, newLinearityResult } from '../core/stats/linearity'
import { createEnvelope } from '../core/stats/envelope'

export interface BucketSeries { codes: number[], min: number[], max: number[] }

/** INL of per-code levels in at most `points` buckets (codes are each bucket's first code). */
export function inlBuckets(levels: ArrayLike<number>, bits: number, def: InlDefinition, points: number): BucketSeries {
  const env = createEnvelope(bits, points)
  linearityFromLevels(levels, def, newLinearityResult(), env)
  const size = 2 ** env.shift
  return { codes: Array.from(env.min, (_, b) => b * size), min: Array.from(env.min), max: Array.from(env.max) }
}
