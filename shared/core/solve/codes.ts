/**
 * Enumeration of all 2^N codes of linear and quadratic functions of the bit vector.
 * Bit convention everywhere in the solvers: bit index i (0 = MSB) of code k is
 * (k >> (N − 1 − i)) & 1.
 */

/**
 * Writes f(k) = scale · Σ_i b_i(k) w_i for every code k into `out` (length ≥ 2^N), O(1) per
 * code: f(k) = f(k without its lowest set bit) + scale · w_bit, so each value is a sum of at
 * most N terms (no long accumulation).
 */
export function linearAllCodes(weights: ArrayLike<number>, scale: number, out: Float64Array): Float64Array {
  const n = weights.length
  const codes = 2 ** n
  const scaled = new Float64Array(n)
  for (let p = 0; p < n; p++) scaled[p] = scale * (weights[n - 1 - p] as number)
  out[0] = 0
  for (let k = 1; k < codes; k++) {
    const low = k & -k
    out[k] = (out[k ^ low] as number) + (scaled[31 - Math.clz32(low)] as number)
  }
  return out
}

/**
 * Writes f(k) = scale · bᵀ Q b for every code k into `out` (length ≥ 2^N), Q symmetric n×n
 * row-major. Walks the codes in Gray order so each step flips one bit: with s = Q b,
 * flipping bit j on adds Q_jj + 2 s_j, off adds Q_jj − 2 s_j; O(N) per code. Rounding grows
 * at worst linearly over the 2^N steps (≈ 2^16 · 1.1e-16 ≈ 1e-11 relative at N = 16), in
 * practice like a random walk (≈ 1e-14).
 */
export function quadraticAllCodes(q: Float64Array, n: number, scale: number, out: Float64Array): Float64Array {
  const codes = 2 ** n
  const s = new Float64Array(n)
  const bits = new Uint8Array(n)
  let f = 0
  out[0] = 0
  for (let g = 1; g < codes; g++) {
    // Gray step g flips the bit at the position of g's lowest set bit (value bit p)
    const p = 31 - Math.clz32(g & -g)
    const j = n - 1 - p
    const row = j * n
    const sj = s[j] as number
    const qjj = q[row + j] as number
    const on = bits[j] === 0
    f += on ? qjj + 2 * sj : qjj - 2 * sj
    bits[j] = on ? 1 : 0
    const sign = on ? 1 : -1
    for (let i = 0; i < n; i++) s[i] = (s[i] as number) + sign * (q[row + i] as number)
    out[g ^ (g >>> 1)] = scale * f
  }
  return out
}
