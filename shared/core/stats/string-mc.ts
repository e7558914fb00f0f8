/**
 * One Monte Carlo trial of a resistor string (MODELS.md §2.1, §4.2) straight from unit normals,
 * without building the level array: r_i = 1 + σ z_i, V(k) ∝ S_k = Σ_{i<k} r_i (code k has k
 * units below its tap). A light first pass gets the line (for the endpoint line only Σz); the
 * second pass gets INL (as a running sum), DNL and the envelope. Equal, to rounding, to `linearityFromLevels` on the
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

/**
 * INL/DNL of a 2^N string whose unit errors are σ·z[0 … n−1] into `out`; widens `env` if given.
 * The top resistor (index n − 1) only changes the gain, so endpoint results ignore it.
 */
export function stringTrial(z: Float64Array, n: number, sigma: number, def: InlDefinition, out: LinearityResult, env?: Envelope): LinearityResult {
  const line = stringLine(z, n, sigma, def)
  const inv = 1 / line.s
  const size = env ? 1 << env.shift : n
  const buckets = n / size
  let hi = -Infinity
  let lo = Infinity
  let k = 0
  // INL(k) = (S_k − a)/s − k, carried as a running value of size O(1 LSB): each unit adds
  // r_k/s − 1 = (inv − 1) + σ·inv·z_k. Rounding stays ~n·ε LSB instead of ~n·ε·2^N.
  let inl = -line.a * inv
  const c0 = inv - 1
  const c1 = sigma * inv
  let zHi = -Infinity
  let zLo = Infinity
  let zHiK = 0
  let zLoK = 0
  for (let b = 0; b < buckets; b++) {
    let bHi = -Infinity
    let bLo = Infinity
    const end = k + size
    for (; k < end; k++) {
      if (inl > bHi) {
        bHi = inl
        if (inl > hi) {
          hi = inl
          out.inlMaxCode = k
        }
      }
      if (inl < bLo) {
        bLo = inl
        if (inl < lo) {
          lo = inl
          out.inlMinCode = k
        }
      }
      const zk = z[k]!
      inl += c0 + c1 * zk
      if (zk > zHi) {
        zHi = zk
        zHiK = k
      }
      if (zk < zLo) {
        zLo = zk
        zLoK = k
      }
    }
    if (env) {
      widenBucket(env, b, bLo, bHi)
    }
  }
  out.inlMaxLsb = hi
  out.inlMinLsb = lo
  // the extremes seen include the top unit, which no one-code step uses: rescan if it is one of them
  if (zHiK === n - 1 || zLoK === n - 1) {
    stringDnl(z, n, sigma, inv, out)
  } else {
    out.dnlMaxLsb = (1 + sigma * zHi) * inv - 1
    out.dnlMinLsb = (1 + sigma * zLo) * inv - 1
    out.dnlMaxCode = zHiK
    out.dnlMinCode = zLoK
  }
  return out
}
