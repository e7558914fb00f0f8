/**
 * One Monte Carlo trial of a resistor string (MODELS.md §2.1, §4.2) straight from unit normals,
 * without building the level array: r_i = 1 + σ z_i, V(k) ∝ S_k = Σ_{i<k} r_i (code k has k
 * units below its tap). Two passes over 2^N values: sums and DNL extremes, then INL and the
 * envelope. Equal, to rounding, to `linearityFromLevels` on the levels (checked in tests).
 */
import type { Envelope } from './envelope'
import { widenBucket } from './envelope'
import type { InlDefinition, LinearityResult } from './linearity'
import { leastSquaresLine } from './linearity'

interface PassOne {
  top: number
  sumS: number
  sumKS: number
  zMax: number
  zMin: number
  zMaxK: number
  zMinK: number
}

function passOne(z: Float64Array, n: number, sigma: number): PassOne {
  let s = 0
  let sumS = 0
  let sumKS = 0
  let zMax = -Infinity
  let zMin = Infinity
  let zMaxK = 0
  let zMinK = 0
  for (let k = 0; k < n - 1; k++) {
    sumS += s
    sumKS += k * s
    const zk = z[k]!
    s += 1 + sigma * zk
    if (zk > zMax) {
      zMax = zk
      zMaxK = k
    }
    if (zk < zMin) {
      zMin = zk
      zMinK = k
    }
  }
  sumS += s
  sumKS += (n - 1) * s
  return { top: s, sumS, sumKS, zMax, zMin, zMaxK, zMinK }
}

/**
 * INL/DNL of a 2^N string whose unit errors are σ·z[0 … n−1] into `out`; widens `env` if given.
 * The top resistor (index n − 1) only changes the gain, so endpoint results ignore it.
 */
export function stringTrial(z: Float64Array, n: number, sigma: number, def: InlDefinition, out: LinearityResult, env?: Envelope): LinearityResult {
  const p = passOne(z, n, sigma)
  const line = def === 'endpoint' ? { a: 0, s: p.top / (n - 1) } : leastSquaresLine(n, p.sumS, p.sumKS)
  const inv = 1 / line.s
  out.dnlMaxLsb = (1 + sigma * p.zMax) * inv - 1
  out.dnlMinLsb = (1 + sigma * p.zMin) * inv - 1
  out.dnlMaxCode = p.zMaxK
  out.dnlMinCode = p.zMinK
  const size = env ? 2 ** env.shift : n
  const buckets = n / size
  let hi = -Infinity
  let lo = Infinity
  let s = 0
  let k = 0
  const shiftA = line.a * inv
  for (let b = 0; b < buckets; b++) {
    let bHi = -Infinity
    let bLo = Infinity
    const end = k + size
    for (; k < end; k++) {
      const inl = s * inv - shiftA - k
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
      s += 1 + sigma * z[k]!
    }
    if (env) {
      widenBucket(env, b, bLo, bHi)
    }
  }
  out.inlMaxLsb = hi
  out.inlMinLsb = lo
  return out
}
