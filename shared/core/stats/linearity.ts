/**
 * INL/DNL extraction (MODELS.md §1), in LSB, for one transfer curve.
 * - `linearityFromLevels`: any curve given per code (strings, brute-force checks), O(2^N).
 * - `linearityFromBinaryWeights`: a ladder with V(k) = offset + Σ b_i w_i, exactly and in O(N):
 *   INL is a linear form in the bits, so its maximum over all codes is the sum of the positive
 *   coefficients; a binary code has only N distinct one-code steps.
 * LSB: endpoint → (V(n−1) − V(0))/(n − 1); best-fit → slope of the least-squares line over all codes.
 */
import type { Envelope } from './envelope'
import { envelopeFromLevels } from './envelope'

export type InlDefinition = 'endpoint' | 'best-fit'

/** Extremes of one curve; a DNL code k refers to the step k → k + 1. Mutable, reused per trial. */
export interface LinearityResult {
  inlMaxLsb: number
  inlMinLsb: number
  inlMaxCode: number
  inlMinCode: number
  dnlMaxLsb: number
  dnlMinLsb: number
  dnlMaxCode: number
  dnlMinCode: number
}

/** A fresh result with neutral extremes. */
export function newLinearityResult(): LinearityResult {
  return { inlMaxLsb: 0, inlMinLsb: 0, inlMaxCode: 0, inlMinCode: 0, dnlMaxLsb: -Infinity, dnlMinLsb: Infinity, dnlMaxCode: 0, dnlMinCode: 0 }
}

/** max |INL| in LSB. */
export function inlAbsLsb(r: LinearityResult): number {
  return Math.max(r.inlMaxLsb, -r.inlMinLsb)
}

/** max |DNL| in LSB. */
export function dnlAbsLsb(r: LinearityResult): number {
  return Math.max(r.dnlMaxLsb, -r.dnlMinLsb)
}

/** Least-squares line V ≈ a + s·k over k = 0 … n − 1 for the given level sums. */
export function leastSquaresLine(n: number, sumV: number, sumKV: number): { a: number, s: number } {
  const meanK = (n - 1) / 2
  const varK = (n * n - 1) / 12
  const meanV = sumV / n
  const s = (sumKV / n - meanK * meanV) / varK
  return { a: meanV - s * meanK, s }
}

/**
 * Per-code INL/DNL of `levels` (any unit; length n = 2^N), written into `out`.
 * If `envelope` is given, its per-bucket INL minima/maxima are widened by this curve.
 */
export function linearityFromLevels(levels: ArrayLike<number>, def: InlDefinition, out: LinearityResult, envelope?: Envelope): LinearityResult {
  const n = levels.length
  let a = levels[0]!
  let s = (levels[n - 1]! - a) / (n - 1)
  if (def === 'best-fit') {
    let sumV = 0
    let sumKV = 0
    for (let k = 0; k < n; k++) {
      sumV += levels[k]!
      sumKV += k * levels[k]!
    }
    const line = leastSquaresLine(n, sumV, sumKV)
    a = line.a
    s = line.s
  }
  scanLevels(levels, a, s, out)
  if (envelope) {
    envelopeFromLevels(envelope, levels, a, s)
  }
  return out
}

function scanLevels(levels: ArrayLike<number>, a: number, s: number, out: LinearityResult): void {
  const inv = 1 / s
  let hi = -Infinity
  let lo = Infinity
  let hiK = 0
  let loK = 0
  let dHi = -Infinity
  let dLo = Infinity
  let dHiK = 0
  let dLoK = 0
  const n = levels.length
  for (let k = 0; k < n; k++) {
    const inl = (levels[k]! - a) * inv - k
    if (inl > hi) {
      hi = inl
      hiK = k
    }
    if (inl < lo) {
      lo = inl
      loK = k
    }
    if (k + 1 < n) {
      const dnl = (levels[k + 1]! - levels[k]!) * inv - 1
      if (dnl > dHi) {
        dHi = dnl
        dHiK = k
      }
      if (dnl < dLo) {
        dLo = dnl
        dLoK = k
      }
    }
  }
  out.inlMaxLsb = hi
  out.inlMinLsb = lo
  out.inlMaxCode = hiK
  out.inlMinCode = loK
  out.dnlMaxLsb = dHi
  out.dnlMinLsb = dLo
  out.dnlMaxCode = dHiK
  out.dnlMinCode = dLoK
}

/**
 * Line (offset a, slope s, both in the unit of w) of a binary-weighted curve V(k) = offset + Σ b_i w_i,
 * w MSB first (ideal weight of bit i is 2^(N−1−i) LSB). Best-fit uses that the bits of a uniformly
 * drawn code are independent fair coins: cov(k, V) = Σ p_i w_i / 4 and var(k) = Σ p_i² / 4.
 */
export function binaryLine(w: ArrayLike<number>, offset: number, def: InlDefinition): { a: number, s: number } {
  const nb = w.length
  let total = 0
  let pw = 0
  let pp = 0
  for (let i = 0; i < nb; i++) {
    const p = (1 << (nb - 1 - i))
    total += w[i]!
    pw += p * w[i]!
    pp += p * p
  }
  if (def === 'endpoint') {
    return { a: offset, s: total / ((1 << nb) - 1) }
  }
  const s = pw / pp
  return { a: offset + total / 2 - (s * ((1 << nb) - 1)) / 2, s }
}

/**
 * Exact INL/DNL of V(k) = offset + Σ b_i w_i over all 2^N codes in O(N), into `out`.
 * @param w bit weights, MSB first (any unit, e.g. fraction of V_REF)
 */
export function linearityFromBinaryWeights(w: ArrayLike<number>, offset: number, def: InlDefinition, out: LinearityResult): LinearityResult {
  const nb = w.length
  const { a, s } = binaryLine(w, offset, def)
  const e0 = (offset - a) / s
  let hi = e0
  let lo = e0
  let hiK = 0
  let loK = 0
  for (let i = 0; i < nb; i++) {
    const p = (1 << (nb - 1 - i))
    const d = w[i]! / s - p
    if (d > 0) {
      hi += d
      hiK += p
    } else {
      lo += d
      loK += p
    }
  }
  out.inlMaxLsb = hi
  out.inlMinLsb = lo
  out.inlMaxCode = hiK
  out.inlMinCode = loK
  binaryDnl(w, s, out)
  return out
}

/** The N distinct one-code steps of a binary code: bit j (LSB index) turns on, bits below turn off. */
function binaryDnl(w: ArrayLike<number>, s: number, out: LinearityResult): void {
  const nb = w.length
  let below = 0
  out.dnlMaxLsb = -Infinity
  out.dnlMinLsb = Infinity
  for (let j = 0; j < nb; j++) {
    const wj = w[nb - 1 - j]!
    const dnl = (wj - below) / s - 1
    if (dnl > out.dnlMaxLsb) {
      out.dnlMaxLsb = dnl
      out.dnlMaxCode = (1 << j) - 1
    }
    if (dnl < out.dnlMinLsb) {
      out.dnlMinLsb = dnl
      out.dnlMinCode = (1 << j) - 1
    }
    below += wj
  }
}
