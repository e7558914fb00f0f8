/**
 * Exact INL/DNL of a segmented curve V(k) = offset + Σ_{l<m} u_l + Σ b_i w_i, code k = m·2^L + c,
 * in O(2^M + L) instead of O(2^N): the unary part is a cumulative sum over m, the binary part a
 * linear form in the L bits, and the two are independent. DNL has L binary steps (the same in
 * every segment) and 2^M − 1 boundary steps u_m − Σ w.
 */
import type { Envelope } from './envelope'
import type { InlDefinition, LinearityResult } from './linearity'
import { leastSquaresLine } from './linearity'
import { segmentedEnvelope } from './segmented-envelope'
import type { LegExtremes } from './segmented-scan'
import { scanUnary } from './segmented-scan'

/** Work arrays for one segmented shape (2^M entries for the cumulative unary INL). */
export interface SegmentedScratch {
  cum: Float64Array
  bucket: Float64Array
}

/** Scratch for M unary bits and an envelope of up to `points` buckets. */
export function createSegmentedScratch(unaryBits: number, points = 256): SegmentedScratch {
  return { cum: new Float64Array((1 << unaryBits)), bucket: new Float64Array(Math.max(points, 2)) }
}

function unaryTotalOf(u: ArrayLike<number>, scale: number): number {
  let total = 0
  for (let m = 0; m < u.length; m++) {
    total += u[m]!
  }
  return total * scale
}

function segmentedLine(u: ArrayLike<number>, uScale: number, uTotal: number, w: ArrayLike<number>, offset: number, def: InlDefinition): { a: number, s: number } {
  const L = w.length
  const legs = u.length
  const n = (legs + 1) * (1 << L)
  let total = 0
  let pw = 0
  for (let i = 0; i < L; i++) {
    total += w[i]!
    pw += (1 << (L - 1 - i)) * w[i]!
  }
  if (def === 'endpoint') {
    return { a: offset, s: (uTotal + total) / (n - 1) }
  }
  let cum = 0
  let sumCum = 0
  let sumMCum = 0
  for (let m = 0; m <= legs; m++) {
    sumCum += cum
    sumMCum += m * cum
    cum += m < legs ? u[m]! * uScale : 0
  }
  // V summed over all codes: each m appears 2^L times; bits are fair coins independent of m.
  const segs = legs + 1
  const meanCum = sumCum / segs
  const covMU = sumMCum / segs - (legs / 2) * meanCum
  const sumV = n * (offset + meanCum + total / 2)
  const covKV = (1 << L) * covMU + pw / 4
  const sumKV = n * (covKV + ((n - 1) / 2) * (sumV / n))
  return leastSquaresLine(n, sumV, sumKV)
}

/**
 * Exact INL/DNL of a segmented curve into `out`; optionally widens `env` (buckets of codes).
 * @param u unary leg weights in thermometer order (2^M − 1 entries)
 * @param w binary weights, MSB first (L entries, L ≥ 1)
 * @param uScale factor applied to every u (lets a caller pass leg conductances and the node voltage)
 * @param uTotal Σ u·uScale if already known (saves a pass), else NaN
 * @param legs positions of the first largest and first smallest u, if already known (saves work in the scan)
 */
export function linearityFromSegmentedWeights(
  u: ArrayLike<number>, w: ArrayLike<number>, offset: number, def: InlDefinition,
  out: LinearityResult, scratch: SegmentedScratch, env?: Envelope, uScale = 1, uTotal = Number.NaN, legs?: LegExtremes
): LinearityResult {
  const L = w.length
  const step = (1 << L)
  const total = Number.isNaN(uTotal) ? unaryTotalOf(u, uScale) : uTotal
  const { a, s } = segmentedLine(u, uScale, total, w, offset, def)
  const e0 = (offset - a) / s
  let pos = 0
  let neg = 0
  let posC = 0
  let negC = 0
  for (let i = 0; i < L; i++) {
    const d = w[i]! / s - (1 << (L - 1 - i))
    if (d > 0) {
      pos += d
      posC += (1 << (L - 1 - i))
    } else {
      neg += d
      negC += (1 << (L - 1 - i))
    }
  }
  const fine = env !== undefined && env.shift < L
  const ext = scanUnary(u, uScale / s, step, e0, scratch, env && !fine ? env : undefined, fine, neg, pos, legs)
  out.inlMaxLsb = ext.hiV + pos
  out.inlMinLsb = ext.loV + neg
  out.inlMaxCode = ext.hiM * step + posC
  out.inlMinCode = ext.loM * step + negC
  segmentedDnl(u, uScale, w, s, out, ext.uHi, ext.uLo)
  if (env && fine) {
    segmentedEnvelope(env, w, s, scratch)
  }
  return out
}

/** L binary steps (the same in every segment) and the extreme boundary steps u_m − Σw (legs uHi, uLo). */
function segmentedDnl(u: ArrayLike<number>, uScale: number, w: ArrayLike<number>, s: number, out: LinearityResult, uHi: number, uLo: number): void {
  const L = w.length
  let below = 0
  out.dnlMaxLsb = -Infinity
  out.dnlMinLsb = Infinity
  for (let j = 0; j < L; j++) {
    const wj = w[L - 1 - j]!
    record(out, (wj - below) / s - 1, (1 << j) - 1)
    below += wj
  }
  if (u.length > 0) {
    record(out, (u[uHi]! * uScale - below) / s - 1, (uHi + 1) * (1 << L) - 1)
    record(out, (u[uLo]! * uScale - below) / s - 1, (uLo + 1) * (1 << L) - 1)
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
