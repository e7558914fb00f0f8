/**
 * Per-bucket INL envelope of a segmented curve when buckets are narrower than one segment
 * (few unary bits): a bucket fixes m and the high bits of the binary section, so its range is
 * cum(m) + fixed(high bits) + [Σ negative low d, Σ positive low d] (see segmented.ts).
 */
import type { Envelope } from './envelope'
import { widenBucket } from './envelope'
import type { SegmentedScratch } from './segmented'

/** Buckets narrower than a segment: each fixes m and the high LSB-section bits. */
export function segmentedEnvelope(env: Envelope, w: ArrayLike<number>, s: number, scratch: SegmentedScratch): void {
  const L = w.length
  const cum = scratch.cum
  const highBits = L - env.shift
  const perSeg = (1 << highBits)
  const fixed = scratch.bucket
  let negLow = 0
  let posLow = 0
  fixed[0] = 0
  for (let i = highBits; i < L; i++) {
    const d = w[i]! / s - (1 << (L - 1 - i))
    negLow += Math.min(0, d)
    posLow += Math.max(0, d)
  }
  for (let h = 1; h < perSeg; h++) {
    const bit = 31 - Math.clz32(h)
    const i = highBits - 1 - bit
    fixed[h] = fixed[h - (1 << bit)]! + w[i]! / s - (1 << (L - 1 - i))
  }
  for (let b = 0; b < env.min.length; b++) {
    const base = cum[b >> highBits]! + fixed[b & (perSeg - 1)]!
    widenBucket(env, b, base + negLow, base + posLow)
  }
}
