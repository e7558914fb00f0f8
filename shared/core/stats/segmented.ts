/**
 * Exact INL/DNL of a segmented curve V(k) = offset + Σ_{l<m} u_l + Σ b_i w_i, code k = m·2^L + c,
 * in O(2^M + L) instead of O(2^N): the unary part is a cumulative sum over m, the binary part a
 * linear form in the L bits, and the two are independent. DNL has L binary steps (the same in
 * every segment) and 2^M − 1 boundary steps u_m − Σ w.
 */
import type { Envelope } from './envelope'
import { widenBucket } from './envelope'
import type { InlDefinition, LinearityResult } from './linearity'
import { leastSquaresLine } from './linearity'

/** Work arrays for one segmented shape (2^M entries for the cumulative unary INL). */
export interface SegmentedScratch {
  cum: Float64Array
  bucket: Float64Array
}

/** Scratch for M unary bits and an envelope of up to `points` buckets. */
export function createSegmentedScratch(unaryBits: number, points = 256): SegmentedScratch {
  return { cum: new Float64Array(2 ** unaryBits), bucket: new Float64Array(Math.max(points, 2)) }
}

function segmentedLine(u: ArrayLike<number>, w: ArrayLike<number>, offset: number, def: InlDefinition): { a: number, s: number } {
  const L = w.length
  const legs = u.length
  const n = (legs + 1) * 2 ** L
  let total = 0
  let pw = 0
  for (let i = 0; i < L; i++) {
    total += w[i]!
    pw += 2 ** (L - 1 - i) * w[i]!
  }
  let cum = 0
  let sumCum = 0
  let sumMCum = 0
  for (let m = 0; m <= legs; m++) {
    sumCum += cum
    sumMCum += m * cum
    cum += m < legs ? u[m]! : 0
  }
  if (def === 'endpoint') {
    return { a: offset, s: (cum + total) / (n - 1) }
  }
  // V summed over all codes: each m appears 2^L times; bits are fair coins independent of m.
  const segs = legs + 1
  const meanCum = sumCum / segs
  const meanM = legs / 2
  const covMU = sumMCum / segs - meanM * meanCum
  const sumV = n * (offset + meanCum + total / 2)
  const meanK = (n - 1) / 2
  const covKV = 2 ** L * covMU + pw / 4
  const sumKV = n * (covKV + meanK * (sumV / n))
  return leastSquaresLine(n, sumV, sumKV)
}

/**
 * Exact INL/DNL of a segmented curve into `out`; optionally widens `env` (buckets of codes).
 * @param u unary leg weights in thermometer order (2^M − 1 entries)
 * @param w binary weights, MSB first (L entries, L ≥ 1)
 */
export function linearityFromSegmentedWeights(
  u: ArrayLike<number>, w: ArrayLike<number>, offset: number, def: InlDefinition,
  out: LinearityResult, scratch: SegmentedScratch, env?: Envelope
): LinearityResult {
  const L = w.length
  const step = 2 ** L
  const { a, s } = segmentedLine(u, w, offset, def)
  const e0 = (offset - a) / s
  let pos = 0
  let neg = 0
  let posC = 0
  let negC = 0
  for (let i = 0; i < L; i++) {
    const d = w[i]! / s - 2 ** (L - 1 - i)
    if (d > 0) {
      pos += d
      posC += 2 ** (L - 1 - i)
    } else {
      neg += d
      negC += 2 ** (L - 1 - i)
    }
  }
  const cum = scratch.cum
  cum[0] = e0
  let hiM = 0
  let loM = 0
  for (let m = 1; m <= u.length; m++) {
    cum[m] = cum[m - 1]! + u[m - 1]! / s - step
    hiM = cum[m]! > cum[hiM]! ? m : hiM
    loM = cum[m]! < cum[loM]! ? m : loM
  }
  out.inlMaxLsb = cum[hiM]! + pos
  out.inlMinLsb = cum[loM]! + neg
  out.inlMaxCode = hiM * step + posC
  out.inlMinCode = loM * step + negC
  segmentedDnl(u, w, s, out)
  if (env) {
    segmentedEnvelope(env, w, s, u.length, scratch, pos, neg)
  }
  return out
}

function segmentedDnl(u: ArrayLike<number>, w: ArrayLike<number>, s: number, out: LinearityResult): void {
  const L = w.length
  let below = 0
  out.dnlMaxLsb = -Infinity
  out.dnlMinLsb = Infinity
  for (let j = 0; j < L; j++) {
    const wj = w[L - 1 - j]!
    record(out, (wj - below) / s - 1, 2 ** j - 1)
    below += wj
  }
  for (let m = 0; m < u.length; m++) {
    record(out, (u[m]! - below) / s - 1, (m + 1) * 2 ** L - 1)
  }
}

function record(out: LinearityResult, dnl: number, code: number): void {
  if (dnl > out.dnlMaxLsb) {
    out.dnlMaxLsb = dnl
    out.dnlMaxCode = code
  }
  if (dnl < out.dnlMinLsb) {
    out.dnlMinLsb = dnl
    out.dnlMinCode = code
  }
}

/** Bucket ranges: buckets wider than a segment span several m; narrower ones fix high LSB-section bits. */
function segmentedEnvelope(env: Envelope, w: ArrayLike<number>, s: number, legs: number, scratch: SegmentedScratch, pos: number, neg: number): void {
  const L = w.length
  const cum = scratch.cum
  if (env.shift >= L) {
    const per = 2 ** (env.shift - L)
    for (let b = 0; b < env.min.length; b++) {
      let lo = Infinity
      let hi = -Infinity
      for (let m = b * per; m < Math.min(legs + 1, (b + 1) * per); m++) {
        lo = Math.min(lo, cum[m]!)
        hi = Math.max(hi, cum[m]!)
      }
      widenBucket(env, b, lo + neg, hi + pos)
    }
    return
  }
  const highBits = L - env.shift
  const perSeg = 2 ** highBits
  const fixed = scratch.bucket
  let negLow = 0
  let posLow = 0
  fixed[0] = 0
  for (let i = 0; i < L; i++) {
    const d = w[i]! / s - 2 ** (L - 1 - i)
    if (i >= highBits) {
      negLow += Math.min(0, d)
      posLow += Math.max(0, d)
    }
  }
  for (let h = 1; h < perSeg; h++) {
    const bit = 31 - Math.clz32(h)
    const i = highBits - 1 - bit
    fixed[h] = fixed[h - 2 ** bit]! + w[i]! / s - 2 ** (L - 1 - i)
  }
  for (let b = 0; b < env.min.length; b++) {
    const base = cum[Math.floor(b / perSeg)]! + fixed[b % perSeg]!
    widenBucket(env, b, base + negLow, base + posLow)
  }
}
