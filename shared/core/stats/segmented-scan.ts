/**
 * The unary pass of the segmented INL/DNL extraction (segmented.ts): the cumulative INL at every
 * segment start, its extremes and their segments, the extreme unary legs, and the envelope
 * buckets at least one segment wide. O(2^M) per trial; the hot loop of a wide segmentation sweep.
 */
import type { Envelope } from './envelope'
import { widenBucket } from './envelope'
import type { SegmentedScratch } from './segmented'
import type { Kernels } from './wasm-kernels'
import { loadedKernels } from './wasm-kernels'

/** Legs per group of the fast scan without an envelope: a new extreme is replayed within its group only. */
const REPLAY_GROUP = 1024

/** Extremes of the cumulative unary INL e0 + Σ_{l<m}(u_l·k − 2^L) over m, and of u itself. */
export interface UnaryExtremes {
  hiV: number
  loV: number
  hiM: number
  loM: number
  uHi: number
  uLo: number
  uHiV: number
  uLoV: number
}

/** Positions of the first largest and first smallest unary leg, when the caller found them already. */
export interface LegExtremes {
  hi: number
  lo: number
}

/**
 * One pass over the unary legs (k = scale per leg in LSB, step = 2^L), group by group. With `env`
 * (buckets at least one segment wide) each bucket's range is widened as the pass goes; `keep`
 * stores the cumulative values in scratch.cum for buckets narrower than a segment. With `legs`
 * the extreme legs are taken from it and the pass tracks only the cumulative INL.
 */
export function scanUnary(u: ArrayLike<number>, k: number, step: number, e0: number, scratch: SegmentedScratch, env: Envelope | undefined, keep: boolean, neg: number, pos: number, legs?: LegExtremes): UnaryExtremes {
  const count = u.length
  const x: UnaryExtremes = { hiV: -Infinity, loV: Infinity, hiM: 0, loM: 0, uHi: 0, uLo: 0, uHiV: -Infinity, uLoV: Infinity }
  const fast = legs !== undefined && !keep
  const group = env ? (1 << env.shift) / step : (fast ? REPLAY_GROUP : count + 1)
  const kernels = fast ? legKernels(u) : null
  if (kernels && Math.floor(count / group) + 1 <= kernels.bucketCapacity) {
    // inlGroup's loop in WebAssembly over the kernels' leg buffer, then its bookkeeping here.
    kernels.unaryScan(count, k, step, e0, group)
    const r = kernels.buckets
    for (let start = 0, b = 0; start <= count; start += group, b++) {
      groupExtremes(u, k, step, start, Math.min(count + 1, start + group), r[3 * b + 2]!, r[3 * b]!, r[3 * b + 1]!, x, env, b, neg, pos)
    }
  } else {
    let c = e0
    for (let start = 0, b = 0; start <= count; start += group, b++) {
      const end = Math.min(count + 1, start + group)
      c = fast ? inlGroup(u, k, step, start, end, c, x, env, b, neg, pos) : unaryGroup(u, k, step, start, end, c, x, keep ? scratch.cum : null, env, b, neg, pos)
    }
  }
  if (legs) {
    x.uHi = legs.hi
    x.uLo = legs.lo
  }
  return x
}

/**
 * `unaryGroup` without the leg extremes and the kept values: the hot loop of a wide sweep (the
 * caller's sampling pass found the extreme legs), so only the cumulative INL is carried.
 */
function inlGroup(u: ArrayLike<number>, k: number, step: number, start: number, end: number, c0: number, x: UnaryExtremes, env: Envelope | undefined, b: number, neg: number, pos: number): number {
  const stop = Math.min(end, u.length)
  // Even and odd m keep their own extremes (shorter Math.max/min chains); c is summed in plain order.
  let hiE = -Infinity
  let loE = Infinity
  let hiO = -Infinity
  let loO = Infinity
  let c = c0
  let m = start
  for (; m + 1 < stop; m += 2) {
    hiE = Math.max(hiE, c)
    loE = Math.min(loE, c)
    c += u[m]! * k - step
    hiO = Math.max(hiO, c)
    loO = Math.min(loO, c)
    c += u[m + 1]! * k - step
  }
  if (m < stop) {
    hiE = Math.max(hiE, c)
    loE = Math.min(loE, c)
    c += u[m]! * k - step
  }
  let hi = Math.max(hiE, hiO)
  let lo = Math.min(loE, loO)
  if (end > stop) {
    hi = Math.max(hi, c)
    lo = Math.min(lo, c)
  }
  groupExtremes(u, k, step, start, end, c0, hi, lo, x, env, b, neg, pos)
  return c
}

/** A group's extremes into the running ones (positions by replay from the group's start value c0) and the envelope. */
function groupExtremes(u: ArrayLike<number>, k: number, step: number, start: number, end: number, c0: number, hi: number, lo: number, x: UnaryExtremes, env: Envelope | undefined, b: number, neg: number, pos: number): void {
  if (hi > x.hiV) {
    x.hiV = hi
    x.hiM = replayTo(u, k, step, start, end, c0, hi)
  }
  if (lo < x.loV) {
    x.loV = lo
    x.loM = replayTo(u, k, step, start, end, c0, lo)
  }
  if (env) {
    widenBucket(env, b, lo + neg, hi + pos)
  }
}

/** The kernels when `u` is their leg buffer. */
function legKernels(u: ArrayLike<number>): Kernels | null {
  const k = loadedKernels()
  return k && u instanceof Float64Array && u.buffer === k.legs.buffer && u.byteOffset === k.legs.byteOffset ? k : null
}

/**
 * Segments [start, end) of the unary scan from the cumulative value c0; returns the value at
 * `end`. Extremes by Math.max/min (the cumulative INL is a random walk, whose record branches
 * mispredict), positions by a replay only when a group beats the running extreme, so values and
 * positions equal a strict first-occurrence scan.
 */
function unaryGroup(u: ArrayLike<number>, k: number, step: number, start: number, end: number, c0: number, x: UnaryExtremes, cum: Float64Array | null, env: Envelope | undefined, b: number, neg: number, pos: number): number {
  const legs = u.length
  const stop = Math.min(end, legs)
  let hi = -Infinity
  let lo = Infinity
  let uh = -Infinity
  let ul = Infinity
  let c = c0
  for (let m = start; m < stop; m++) {
    if (cum) {
      cum[m] = c
    }
    hi = Math.max(hi, c)
    lo = Math.min(lo, c)
    const um = u[m]!
    c += um * k - step
    uh = Math.max(uh, um)
    ul = Math.min(ul, um)
  }
  if (end > legs) {
    if (cum) {
      cum[legs] = c
    }
    hi = Math.max(hi, c)
    lo = Math.min(lo, c)
  }
  if (hi > x.hiV) {
    x.hiV = hi
    x.hiM = replayTo(u, k, step, start, end, c0, hi)
  }
  if (lo < x.loV) {
    x.loV = lo
    x.loM = replayTo(u, k, step, start, end, c0, lo)
  }
  if (uh > x.uHiV) {
    x.uHiV = uh
    x.uHi = firstEqual(u, start, stop, uh)
  }
  if (ul < x.uLoV) {
    x.uLoV = ul
    x.uLo = firstEqual(u, start, stop, ul)
  }
  if (env) {
    widenBucket(env, b, lo + neg, hi + pos)
  }
  return c
}

/** First m in [start, end) whose cumulative value (replayed from c0 with the same arithmetic) equals target. */
function replayTo(u: ArrayLike<number>, k: number, step: number, start: number, end: number, c0: number, target: number): number {
  let c = c0
  for (let m = start; m < end; m++) {
    if (c === target) {
      return m
    }
    c += u[m]! * k - step
  }
  return end - 1
}

/** First m in [start, stop) with u[m] === target. */
function firstEqual(u: ArrayLike<number>, start: number, stop: number, target: number): number {
  for (let m = start; m < stop; m++) {
    if (u[m] === target) {
      return m
    }
  }
  return start
}
