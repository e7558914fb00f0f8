/**
 * Per-code INL envelopes, decimated for charts without losing extremes: codes are grouped in
 * aligned buckets of 2^shift codes and each bucket keeps the minimum and maximum over its codes
 * (and over Monte Carlo trials). Buckets merge by min/max, so chunked runs combine exactly.
 */

/** INL envelope (LSB) over buckets of 2^shift codes; bucket b covers codes [b·2^shift, (b+1)·2^shift). */
export interface Envelope {
  bits: number
  shift: number
  min: Float64Array
  max: Float64Array
}

/** An empty envelope for 2^bits codes with at most `maxPoints` buckets (a power of two is used). */
export function createEnvelope(bits: number, maxPoints = 256): Envelope {
  const pointBits = Math.min(bits, Math.floor(Math.log2(Math.max(1, maxPoints))))
  const count = (1 << pointBits)
  return { bits, shift: bits - pointBits, min: new Float64Array(count).fill(Infinity), max: new Float64Array(count).fill(-Infinity) }
}

/** Widens `into` by `other` (same bits and shift). */
export function mergeEnvelope(into: Envelope, other: { min: ArrayLike<number>, max: ArrayLike<number> }): void {
  for (let b = 0; b < into.min.length; b++) {
    into.min[b] = Math.min(into.min[b]!, other.min[b]!)
    into.max[b] = Math.max(into.max[b]!, other.max[b]!)
  }
}

/** Widens bucket b by the INL range [lo, hi]. */
export function widenBucket(env: Envelope, b: number, lo: number, hi: number): void {
  if (lo < env.min[b]!) {
    env.min[b] = lo
  }
  if (hi > env.max[b]!) {
    env.max[b] = hi
  }
}

/** Widens the envelope by the INL of per-code levels against the line a + s·k. */
export function envelopeFromLevels(env: Envelope, levels: ArrayLike<number>, a: number, s: number): void {
  const size = (1 << env.shift)
  const inv = 1 / s
  for (let b = 0; b < env.min.length; b++) {
    let lo = Infinity
    let hi = -Infinity
    const end = (b + 1) * size
    for (let k = b * size; k < end; k++) {
      const inl = (levels[k]! - a) * inv - k
      lo = inl < lo ? inl : lo
      hi = inl > hi ? inl : hi
    }
    widenBucket(env, b, lo, hi)
  }
}

/**
 * Widens the envelope by a binary-weighted curve: INL(k) = e0 + Σ b_i d_i with d MSB first.
 * Inside an aligned bucket the high bits are fixed and the low `shift` bits are free, so the bucket
 * range is e0 + fixed(b) + [Σ negative low d, Σ positive low d]. `scratch` needs ≥ buckets entries.
 */
export function envelopeFromBinary(env: Envelope, e0: number, d: ArrayLike<number>, scratch: Float64Array): void {
  const nb = d.length
  const low = Math.min(env.shift, nb)
  let negLow = 0
  let posLow = 0
  for (let i = nb - low; i < nb; i++) {
    negLow += Math.min(0, d[i]!)
    posLow += Math.max(0, d[i]!)
  }
  const buckets = env.min.length
  const highBits = nb - low
  scratch[0] = e0
  for (let b = 1; b < buckets; b++) {
    const bit = 31 - Math.clz32(b)
    scratch[b] = scratch[b - (1 << bit)]! + d[highBits - 1 - bit]!
  }
  for (let b = 0; b < buckets; b++) {
    widenBucket(env, b, scratch[b]! + negLow, scratch[b]! + posLow)
  }
}

/** Per-bucket minimum and maximum of a per-code series, for charts (bucket start codes in `codes`). */
export interface DecimatedSeries {
  codes: number[]
  min: (number | null)[]
  max: (number | null)[]
}

/**
 * Decimates a per-code series into at most `maxPoints` buckets keeping each bucket's extremes.
 * Non-finite values (e.g. R_in = ∞ at code 0) are skipped; a bucket with none left reports null.
 */
export function decimateSeries(values: ArrayLike<number>, maxPoints = 256): DecimatedSeries {
  const n = values.length
  const size = Math.max(1, Math.ceil(n / maxPoints))
  const out: DecimatedSeries = { codes: [], min: [], max: [] }
  for (let start = 0; start < n; start += size) {
    let lo = Infinity
    let hi = -Infinity
    for (let k = start; k < Math.min(n, start + size); k++) {
      const v = values[k]!
      if (Number.isFinite(v)) {
        lo = Math.min(lo, v)
        hi = Math.max(hi, v)
      }
    }
    out.codes.push(start)
    out.min.push(lo <= hi ? lo : null)
    out.max.push(lo <= hi ? hi : null)
  }
  return out
}
