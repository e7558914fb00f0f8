/**
 * One Monte Carlo trial of a resistor string (MODELS.md §2.1, §4.2) straight from unit normals,
 * without building the level array: r_i = 1 + σ z_i, V(k) ∝ S_k = Σ_{i<k} r_i (code k has k
 * units below its tap). A light first pass gets the line (for the endpoint line only Σz); the
 * second pass gets INL (as a running sum), DNL and the envelope, bucket by bucket. Equal, to rounding, to `linearityFromLevels` on the
 * levels (checked in tests).
 */
import type { Envelope } from './envelope'
import { widenBucket } from './envelope'
import type { InlDefinition, LinearityResult } from './linearity'
import { leastSquaresLine } from './linearity'

function sumOf(z: Float64Array, count: number): number {
  let sum = 0
  for (let k = 0; k < count; k++) {
    sum += z[k]!
  }
  return sum
}

/** Line a + s·k through the levels S_k (endpoint: through S_0 = 0 and S_{n−1}). */
function stringLine(z: Float64Array, n: number, sigma: number, def: InlDefinition): { a: number, s: number } {
  if (def === 'endpoint') {
    return { a: 0, s: (n - 1 + sigma * sumOf(z, n - 1)) / (n - 1) }
  }
  return bestFitLine(z, n, sigma)
}

function bestFitLine(z: Float64Array, n: number, sigma: number): { a: number, s: number } {
  let s = 0
  let sumS = 0
  let sumKS = 0
  for (let k = 0; k < n; k++) {
    sumS += s
    sumKS += k * s
    s += 1 + sigma * z[k]!
  }
  return leastSquaresLine(n, sumS, sumKS)
}

/** DNL extremes from the unit values r_k (steps k = 0 … n − 2), written into `out`. */
function stringDnl(z: Float64Array, n: number, sigma: number, inv: number, out: LinearityResult): void {
  let zMax = -Infinity
  let zMin = Infinity
  for (let k = 0; k < n - 1; k++) {
    const zk = z[k]!
    if (zk > zMax) {
      zMax = zk
      out.dnlMaxCode = k
    }
    if (zk < zMin) {
      zMin = zk
      out.dnlMinCode = k
    }
  }
  out.dnlMaxLsb = (1 + sigma * zMax) * inv - 1
  out.dnlMinLsb = (1 + sigma * zMin) * inv - 1
}

/** First code in [from, to) whose running INL (replayed from `start` with the same arithmetic) equals `target`. */
function inlCodeOf(z: Float64Array, from: number, to: number, start: number, c0: number, c1: number, target: number): number {
  let inl = start
  for (let k = from; k < to; k++) {
    if (inl === target) {
      return k
    }
    inl += c0 + c1 * z[k]!
  }
  return to - 1
}

/** First index in [from, to) with z[k] === target. */
function zCodeOf(z: Float64Array, from: number, to: number, target: number): number {
  for (let k = from; k < to; k++) {
    if (z[k] === target) {
      return k
    }
  }
  return to - 1
}

/** Running extremes of one trial: INL over codes, z over units (values, then codes). */
interface StringExtremes {
  hi: number
  lo: number
  zHi: number
  zLo: number
  zHiK: number
  zLoK: number
}

/**
 * INL/DNL of a 2^N string whose unit errors are σ·z[0 … n−1] into `out`; widens `env` if given.
 * The top resistor (index n − 1) only changes the gain, so endpoint results ignore it.
 */
export function stringTrial(z: Float64Array, n: number, sigma: number, def: InlDefinition, out: LinearityResult, env?: Envelope): LinearityResult {
  const line = stringLine(z, n, sigma, def)
  const inv = 1 / line.s
  const size = env ? 1 << env.shift : n
  // INL(k) = (S_k − a)/s − k, carried as a running value of size O(1 LSB): each unit adds
  // r_k/s − 1 = (inv − 1) + σ·inv·z_k. Rounding stays ~n·ε LSB instead of ~n·ε·2^N.
  const c0 = inv - 1
  const c1 = sigma * inv
  const x: StringExtremes = { hi: -Infinity, lo: Infinity, zHi: -Infinity, zLo: Infinity, zHiK: 0, zLoK: 0 }
  let inl = -line.a * inv
  for (let b = 0, from = 0; from < n; b++, from += size) {
    inl = stringBucket(z, from, from + size, inl, c0, c1, x, out, env, b)
  }
  out.inlMaxLsb = x.hi
  out.inlMinLsb = x.lo
  // the extremes seen include the top unit, which no one-code step uses: rescan if it is one of them
  if (x.zHiK === n - 1 || x.zLoK === n - 1) {
    stringDnl(z, n, sigma, inv, out)
  } else {
    out.dnlMaxLsb = (1 + sigma * x.zHi) * inv - 1
    out.dnlMinLsb = (1 + sigma * x.zLo) * inv - 1
    out.dnlMaxCode = x.zHiK
    out.dnlMinCode = x.zLoK
  }
  return out
}

/**
 * One bucket of codes [from, to): extremes by Math.max/min (no data-dependent branch in the
 * loop, which a random walk would mispredict), codes found by a replay only when a bucket beats
 * the running extreme, so values and codes equal a strict first-occurrence scan. Returns the INL
 * at `to`.
 */
function stringBucket(z: Float64Array, from: number, to: number, inl0: number, c0: number, c1: number, x: StringExtremes, out: LinearityResult, env: Envelope | undefined, b: number): number {
  let bHi = -Infinity
  let bLo = Infinity
  let zHi = -Infinity
  let zLo = Infinity
  let inl = inl0
  for (let k = from; k < to; k++) {
    bHi = Math.max(bHi, inl)
    bLo = Math.min(bLo, inl)
    const zk = z[k]!
    inl += c0 + c1 * zk
    zHi = Math.max(zHi, zk)
    zLo = Math.min(zLo, zk)
  }
  if (bHi > x.hi) {
    x.hi = bHi
    out.inlMaxCode = inlCodeOf(z, from, to, inl0, c0, c1, bHi)
  }
  if (bLo < x.lo) {
    x.lo = bLo
    out.inlMinCode = inlCodeOf(z, from, to, inl0, c0, c1, bLo)
  }
  if (zHi > x.zHi) {
    x.zHi = zHi
    x.zHiK = zCodeOf(z, from, to, zHi)
  }
  if (zLo < x.zLo) {
    x.zLo = zLo
    x.zLoK = zCodeOf(z, from, to, zLo)
  }
  if (env) {
    widenBucket(env, b, bLo, bHi)
  }
  return inl
}
