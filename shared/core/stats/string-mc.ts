/**
 * One Monte Carlo trial of a resistor string (MODELS.md §2.1, §4.2) straight from unit normals,
 * without building the level array: r_i = 1 + σ z_i, V(k) ∝ S_k = Σ_{i<k} r_i (code k has k
 * units below its tap). A light first pass gets the line (for the endpoint line only Σz) and the
 * extreme units (DNL); the second pass gets INL (as a running sum) and the envelope, bucket by
 * bucket. Equal, to rounding, to `linearityFromLevels` on the levels (checked in tests).
 */
import type { Envelope } from './envelope'
import { widenBucket } from './envelope'
import type { InlDefinition, LinearityResult } from './linearity'
import { leastSquaresLine } from './linearity'
import { kernelsFor } from './wasm-kernels'

/** Codes per bucket when no envelope is kept (see stringTrial). */
const REPLAY_BUCKET = 1024

/** Extreme units z over the one-code steps k = 0 … n − 2 (first occurrence), found by the line pass. */
interface UnitExtremes {
  zHi: number
  zLo: number
  zHiK: number
  zLoK: number
}

/** Σ z[0 … n−2] (the endpoint line) and the extreme units; new records of iid values are rare, so the branches are cheap. */
function endpointPass(z: Float64Array, n: number, x: UnitExtremes): number {
  let sum = 0
  for (let k = 0; k < n - 1; k++) {
    const zk = z[k]!
    sum += zk
    if (zk > x.zHi) {
      x.zHi = zk
      x.zHiK = k
    }
    if (zk < x.zLo) {
      x.zLo = zk
      x.zLoK = k
    }
  }
  return sum
}

/** Least-squares line of the levels S_k and the extreme units (the top unit, k = n − 1, is no one-code step). */
function bestFitPass(z: Float64Array, n: number, sigma: number, x: UnitExtremes): { a: number, s: number } {
  let s = 0
  let sumS = 0
  let sumKS = 0
  for (let k = 0; k < n; k++) {
    sumS += s
    sumKS += k * s
    const zk = z[k]!
    s += 1 + sigma * zk
    if (k < n - 1) {
      if (zk > x.zHi) {
        x.zHi = zk
        x.zHiK = k
      }
      if (zk < x.zLo) {
        x.zLo = zk
        x.zLoK = k
      }
    }
  }
  return leastSquaresLine(n, sumS, sumKS)
}

/**
 * Σ z[0 … count) in index order and the first largest and smallest positions there, as the
 * generator found them while writing z (stats/montecarlo.ts); equal to what `endpointPass` computes.
 */
export interface NormalsSummary {
  count: number
  sum: number
  hiK: number
  loK: number
}

/** Line a + s·k through the levels S_k (endpoint: through S_0 = 0 and S_{n−1}); fills `x`. */
function stringLine(z: Float64Array, n: number, sigma: number, def: InlDefinition, x: UnitExtremes, zs?: NormalsSummary): { a: number, s: number } {
  if (def === 'endpoint') {
    if (zs && zs.count === n - 1 && n > 1) {
      x.zHi = z[zs.hiK]!
      x.zHiK = zs.hiK
      x.zLo = z[zs.loK]!
      x.zLoK = zs.loK
      return { a: 0, s: (n - 1 + sigma * zs.sum) / (n - 1) }
    }
    return { a: 0, s: (n - 1 + sigma * endpointPass(z, n, x)) / (n - 1) }
  }
  return bestFitPass(z, n, sigma, x)
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

/**
 * INL/DNL of a 2^N string whose unit errors are σ·z[0 … n−1] into `out`; widens `env` if given.
 * The top resistor (index n − 1) only changes the gain, so endpoint results ignore it.
 * `zs`, the summary of z[0 … n−1) when the caller has it, saves the endpoint line's pass.
 */
export function stringTrial(z: Float64Array, n: number, sigma: number, def: InlDefinition, out: LinearityResult, env?: Envelope, zs?: NormalsSummary): LinearityResult {
  const x: UnitExtremes = { zHi: -Infinity, zLo: Infinity, zHiK: 0, zLoK: 0 }
  const line = stringLine(z, n, sigma, def, x, zs)
  const inv = 1 / line.s
  // Without an envelope, buckets still bound the replay that finds a new extreme's code.
  const size = env ? 1 << env.shift : Math.min(n, REPLAY_BUCKET)
  // INL(k) = (S_k − a)/s − k, carried as a running value of size O(1 LSB): each unit adds
  // r_k/s − 1 = (inv − 1) + σ·inv·z_k. Rounding stays ~n·ε LSB instead of ~n·ε·2^N.
  const c0 = inv - 1
  const c1 = sigma * inv
  const range = { hi: -Infinity, lo: Infinity }
  const inl0 = -line.a * inv
  const k = kernelsFor(z)
  if (k && n / size <= k.bucketCapacity) {
    // The same scan in WebAssembly, then the same bucket-by-bucket bookkeeping here.
    k.stringScan(0, n, size, inl0, c0, c1)
    const r = k.buckets
    for (let b = 0, from = 0; from < n; b++, from += size) {
      bucketExtremes(z, from, from + size, r[3 * b + 2]!, c0, c1, r[3 * b]!, r[3 * b + 1]!, range, out, env, b)
    }
  } else {
    let inl = inl0
    for (let b = 0, from = 0; from < n; b++, from += size) {
      inl = stringBucket(z, from, from + size, inl, c0, c1, range, out, env, b)
    }
  }
  out.inlMaxLsb = range.hi
  out.inlMinLsb = range.lo
  out.dnlMaxLsb = (1 + sigma * x.zHi) * inv - 1
  out.dnlMinLsb = (1 + sigma * x.zLo) * inv - 1
  out.dnlMaxCode = x.zHiK
  out.dnlMinCode = x.zLoK
  return out
}

/**
 * One bucket of codes [from, to): extremes by Math.max/min (no data-dependent branch in the
 * loop, which a random walk would mispredict), codes found by a replay only when a bucket beats
 * the running extreme, so values and codes equal a strict first-occurrence scan. Returns the INL
 * at `to`.
 */
function stringBucket(z: Float64Array, from: number, to: number, inl0: number, c0: number, c1: number, range: { hi: number, lo: number }, out: LinearityResult, env: Envelope | undefined, b: number): number {
  // Two pairs of extremes (even and odd k) halve the Math.max/min dependency chains; the running
  // INL itself is summed in the same order as a plain loop, so every value is unchanged.
  let hiE = -Infinity
  let loE = Infinity
  let hiO = -Infinity
  let loO = Infinity
  let inl = inl0
  let k = from
  for (; k + 1 < to; k += 2) {
    hiE = Math.max(hiE, inl)
    loE = Math.min(loE, inl)
    inl += c0 + c1 * z[k]!
    hiO = Math.max(hiO, inl)
    loO = Math.min(loO, inl)
    inl += c0 + c1 * z[k + 1]!
  }
  if (k < to) {
    hiE = Math.max(hiE, inl)
    loE = Math.min(loE, inl)
    inl += c0 + c1 * z[k]!
  }
  bucketExtremes(z, from, to, inl0, c0, c1, Math.max(hiE, hiO), Math.min(loE, loO), range, out, env, b)
  return inl
}

/** A bucket's extremes into the running range (codes by replay from its start value) and the envelope. */
function bucketExtremes(z: Float64Array, from: number, to: number, inl0: number, c0: number, c1: number, bHi: number, bLo: number, range: { hi: number, lo: number }, out: LinearityResult, env: Envelope | undefined, b: number): void {
  if (bHi > range.hi) {
    range.hi = bHi
    out.inlMaxCode = inlCodeOf(z, from, to, inl0, c0, c1, bHi)
  }
  if (bLo < range.lo) {
    range.lo = bLo
    out.inlMinCode = inlCodeOf(z, from, to, inl0, c0, c1, bLo)
  }
  if (env) {
    widenBucket(env, b, bLo, bHi)
  }
}
