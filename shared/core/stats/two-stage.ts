/**
 * Exact INL/DNL of a two-stage string (MODELS.md §2.5) from its element values, without
 * visiting all 2^N codes. Code k = m·2^L + c gives V = A_m + B_m·S_c (S_c = Σ_{i<c} fine r_i):
 * - buffered: the fine string spans copies of coarse nodes m and m + 1 (plus buffer offsets);
 * - unbuffered: it hangs across coarse resistor m and loads it (R_c ∥ ΣR_f).
 * Per segment, max/min over c of (B_m/s)·S_c − c are support queries on convex hulls of the
 * fine path (hull.ts), so a trial costs O(2^M log 2^L + 2^L).
 */
import type { BlockHulls } from './hull'
import { argMaxSupport, argMinSupport, buildBlockHulls, createBlockHulls } from './hull'
import type { Envelope } from './envelope'
import { widenBucket } from './envelope'
import type { InlDefinition, LinearityResult } from './linearity'
import { leastSquaresLine } from './linearity'

/** Work arrays for one two-stage shape. */
export interface TwoStageScratch {
  a: Float64Array
  b: Float64Array
  s: Float64Array
  hulls: BlockHulls
}

/** Scratch for M coarse and L fine bits, with room for up to 2^L hull blocks. */
export function createTwoStageScratch(coarseBits: number, fineBits: number): TwoStageScratch {
  const fine = 2 ** fineBits
  return { a: new Float64Array(2 ** coarseBits), b: new Float64Array(2 ** coarseBits), s: new Float64Array(fine), hulls: createBlockHulls(fine, fine) }
}

/** Element values of one sample (any common unit); offsets in units of V_REF (buffered only). */
export interface TwoStageSample {
  coarse: ArrayLike<number>
  fine: ArrayLike<number>
  buffered: boolean
  offsetLo: number
  offsetHi: number
  /** unbuffered: on-resistance of each of the two coarse selection switches in series with the fine string (same unit) */
  switchRel?: number
}

/** Fills A_m, B_m (levels per V_REF) and S_c; returns ΣR_f. */
function segmentsOf(x: TwoStageSample, w: TwoStageScratch): number {
  const fine = x.fine.length
  let sf = 0
  for (let c = 0; c < fine; c++) {
    w.s[c] = sf
    sf += x.fine[c]!
  }
  let total = 0
  for (let m = 0; m < x.coarse.length; m++) {
    total += x.coarse[m]!
  }
  let below = 0
  for (let m = 0; m < x.coarse.length; m++) {
    const rc = x.coarse[m]!
    if (x.buffered) {
      w.a[m] = below / total + x.offsetLo
      w.b[m] = (rc / total + x.offsetHi - x.offsetLo) / sf
    } else {
      // the fine string hangs across rc through two selection switches: taps sit sw above S_c
      const sw = x.switchRel ?? 0
      const rf = sf + 2 * sw
      const par = (rc * rf) / (rc + rf)
      const rTot = total - rc + par
      w.b[m] = par / rTot / rf
      w.a[m] = below / rTot + w.b[m]! * sw
    }
    below += rc
  }
  return sf
}

function lineOf(w: TwoStageScratch, segs: number, fine: number, def: InlDefinition): { a: number, s: number } {
  const n = segs * fine
  const sLast = w.s[fine - 1]!
  if (def === 'endpoint') {
    return { a: w.a[0]!, s: (w.a[segs - 1]! + w.b[segs - 1]! * sLast - w.a[0]!) / (n - 1) }
  }
  let sumS = 0
  let sumCS = 0
  for (let c = 0; c < fine; c++) {
    sumS += w.s[c]!
    sumCS += c * w.s[c]!
  }
  const sumC = (fine * (fine - 1)) / 2
  let sumV = 0
  let sumKV = 0
  for (let m = 0; m < segs; m++) {
    const seg = fine * w.a[m]! + w.b[m]! * sumS
    sumV += seg
    sumKV += m * fine * seg + w.a[m]! * sumC + w.b[m]! * sumCS
  }
  return leastSquaresLine(n, sumV, sumKV)
}

function dnlOf(x: TwoStageSample, w: TwoStageScratch, s: number, out: LinearityResult): void {
  const fine = x.fine.length
  let fMax = 0
  let fMin = 0
  for (let c = 1; c < fine - 1; c++) {
    fMax = x.fine[c]! > x.fine[fMax]! ? c : fMax
    fMin = x.fine[c]! < x.fine[fMin]! ? c : fMin
  }
  out.dnlMaxLsb = -Infinity
  out.dnlMinLsb = Infinity
  const sLast = w.s[fine - 1]!
  for (let m = 0; m < x.coarse.length; m++) {
    const b = w.b[m]!
    note(out, b * x.fine[fMax]! / s - 1, m * fine + fMax)
    note(out, b * x.fine[fMin]! / s - 1, m * fine + fMin)
    if (m + 1 < x.coarse.length) {
      note(out, (w.a[m + 1]! - w.a[m]! - b * sLast) / s - 1, (m + 1) * fine - 1)
    }
  }
}

function note(out: LinearityResult, dnl: number, code: number): void {
  if (dnl > out.dnlMaxLsb) {
    out.dnlMaxLsb = dnl
    out.dnlMaxCode = code
  }
  if (dnl < out.dnlMinLsb) {
    out.dnlMinLsb = dnl
    out.dnlMinCode = code
  }
}

/** Exact INL/DNL of one two-stage sample into `out`; widens `env` per bucket of codes if given. */
export function twoStageTrial(x: TwoStageSample, def: InlDefinition, out: LinearityResult, w: TwoStageScratch, env?: Envelope): LinearityResult {
  const fine = x.fine.length
  const segs = x.coarse.length
  const fineBits = Math.log2(fine)
  segmentsOf(x, w)
  const { a, s } = lineOf(w, segs, fine, def)
  const blockBits = env ? Math.min(env.shift, fineBits) : fineBits
  const size = 2 ** blockBits
  const blocks = fine / size
  buildBlockHulls(w.s, size, blocks, w.hulls)
  out.inlMaxLsb = -Infinity
  out.inlMinLsb = Infinity
  for (let m = 0; m < segs; m++) {
    const beta = w.b[m]! / s
    const base = (w.a[m]! - a) / s - m * fine
    let segHi = -Infinity
    let segLo = Infinity
    for (let j = 0; j < blocks; j++) {
      const cHi = argMaxSupport(w.s, w.hulls, j, beta)
      const cLo = argMinSupport(w.s, w.hulls, j, beta)
      const hi = base + beta * w.s[cHi]! - cHi
      const lo = base + beta * w.s[cLo]! - cLo
      if (hi > out.inlMaxLsb) {
        out.inlMaxLsb = hi
        out.inlMaxCode = m * fine + cHi
      }
      if (lo < out.inlMinLsb) {
        out.inlMinLsb = lo
        out.inlMinCode = m * fine + cLo
      }
      if (env && blockBits < fineBits) {
        widenBucket(env, m * blocks + j, lo, hi)
      }
      segHi = Math.max(segHi, hi)
      segLo = Math.min(segLo, lo)
    }
    if (env && blockBits === fineBits) {
      widenBucket(env, m >> (env.shift - fineBits), segLo, segHi)
    }
  }
  dnlOf(x, w, s, out)
  return out
}
