/**
 * Enumeration of all 2^N codes of linear and quadratic functions of the bit vector.
 * Bit convention everywhere in the solvers: bit index i (0 = MSB) of code k is
 * (k >> (N − 1 − i)) & 1.
 */

/**
 * Writes f(k) = scale · Σ_i b_i(k) w_i for every code k into `out` (length ≥ 2^N): codes are
 * built by doubling, f(2^p + k) = f(k) + scale · w_p for k < 2^p, so each value is a sum of at
 * most N terms (no long accumulation) and each code costs one addition. Allocation-free (it
 * runs once per Monte Carlo sample).
 */
export function linearAllCodes(weights: ArrayLike<number>, scale: number, out: Float64Array): Float64Array {
  const n = weights.length
  const first = n < 3 ? n : 3
  out[0] = 0
  for (let p = 0; p < first; p++) {
    const wp = scale * (weights[n - 1 - p] as number)
    const half = 1 << p
    for (let k = 0; k < half; k++) out[half + k] = (out[k] as number) + wp
  }
  for (let p = first; p < n; p++) doubleBy8(out, 1 << p, scale * (weights[n - 1 - p] as number))
  return out
}

/** out[half + k] = out[k] + wp for k < half (half a multiple of 8), unrolled: the hot loop of Monte Carlo. */
function doubleBy8(out: Float64Array, half: number, wp: number): void {
  for (let k = 0; k < half; k += 8) {
    const d = half + k
    out[d] = (out[k] as number) + wp
    out[d + 1] = (out[k + 1] as number) + wp
    out[d + 2] = (out[k + 2] as number) + wp
    out[d + 3] = (out[k + 3] as number) + wp
    out[d + 4] = (out[k + 4] as number) + wp
    out[d + 5] = (out[k + 5] as number) + wp
    out[d + 6] = (out[k + 6] as number) + wp
    out[d + 7] = (out[k + 7] as number) + wp
  }
}

/** Gray-order walk for small n: each step flips one bit j, f += Q_jj ± 2 (Q b)_j; O(n) per code. */
function quadraticGray(q: Float64Array, n: number, out: Float64Array): void {
  const s = new Float64Array(n)
  const bits = new Uint8Array(n)
  let f = 0
  out[0] = 0
  for (let g = 1; g < 2 ** n; g++) {
    const j = n - 1 - (31 - Math.clz32(g & -g))
    const row = j * n
    const on = bits[j] === 0
    f += on ? (q[row + j] as number) + 2 * (s[j] as number) : (q[row + j] as number) - 2 * (s[j] as number)
    bits[j] = on ? 1 : 0
    const sign = on ? 1 : -1
    for (let i = 0; i < n; i++) s[i] = (s[i] as number) + sign * (q[row + i] as number)
    out[g ^ (g >>> 1)] = f
  }
}

function submatrix(q: Float64Array, n: number, from: number, size: number): Float64Array {
  const out = new Float64Array(size * size)
  for (let i = 0; i < size; i++) {
    for (let j = 0; j < size; j++) out[i * size + j] = q[(from + i) * n + from + j] as number
  }
  return out
}

/**
 * Writes f(k) = scale · bᵀ Q b for every code k into `out` (length ≥ 2^N), Q symmetric n×n
 * row-major. Splits the bits into a high part h and a low part l:
 * f(h, l) = f_H(h) + f_L(l) + 2 hᵀ Q_HL l, where the cross term is, for each h, a linear
 * function of l enumerated by {@link linearAllCodes}. About three operations per code and
 * every value is a short sum (no accumulation over codes).
 */
export function quadraticAllCodes(q: Float64Array, n: number, scale: number, out: Float64Array): Float64Array {
  if (n <= 6) {
    quadraticGray(q, n, out)
    for (let k = 0; k < 2 ** n; k++) out[k] = scale * (out[k] as number)
    return out
  }
  const lo = n >> 1
  const hi = n - lo
  const fH = quadraticAllCodes(submatrix(q, n, 0, hi), hi, 1, new Float64Array(2 ** hi))
  const fL = quadraticAllCodes(submatrix(q, n, hi, lo), lo, 1, new Float64Array(2 ** lo))
  // cross[h][j] = Σ_{i ∈ h} Q_{i, hi+j}, built by doubling over the high codes
  const cross = new Float64Array(2 ** hi * lo)
  for (let p = 0; p < hi; p++) {
    const row = (hi - 1 - p) * n + hi
    const half = 1 << p
    for (let h = 0; h < half; h++) {
      for (let j = 0; j < lo; j++) cross[(half + h) * lo + j] = (cross[h * lo + j] as number) + (q[row + j] as number)
    }
  }
  const lin = new Float64Array(2 ** lo)
  const lowCodes = 2 ** lo
  for (let h = 0; h < 2 ** hi; h++) {
    linearAllCodes(cross.subarray(h * lo, (h + 1) * lo), 2, lin)
    const base = h * lowCodes
    const fh = fH[h] as number
    for (let l = 0; l < lowCodes; l++) out[base + l] = scale * (fh + (fL[l] as number) + (lin[l] as number))
  }
  return out
}
