/**
 * Dense inverse of a symmetric tridiagonal conductance matrix, for the small (N ≤ 24) matrices
 * of ladders: G = diag(d) − offdiag(c), with c_i ≥ 0 the conductance between node i and i+1.
 * Used where the full G⁻¹ is needed (reference current as a quadratic form in the bits).
 */

/**
 * Returns H = G⁻¹ as a row-major n×n Float64Array (ohms), by one Thomas solve per column.
 * Precondition: G is a conductance matrix with every node connected to a source or ground
 * through some path (positive definite), so the elimination needs no pivoting.
 * @param d diagonal (siemens), length n
 * @param c coupling conductances (siemens), length n − 1
 */
export function tridiagonalInverse(d: ArrayLike<number>, c: ArrayLike<number>): Float64Array {
  const n = d.length
  const h = new Float64Array(n * n)
  // LU of the tridiagonal: pivots p_i and multipliers m_i = −c_{i−1} / p_{i−1}
  const p = new Float64Array(n)
  const m = new Float64Array(n)
  p[0] = d[0] as number
  for (let i = 1; i < n; i++) {
    const ci = c[i - 1] as number
    m[i] = -ci / (p[i - 1] as number)
    p[i] = (d[i] as number) - (m[i] as number) * -ci
  }
  const y = new Float64Array(n)
  for (let col = 0; col < n; col++) {
    for (let i = 0; i < n; i++) {
      const e = i === col ? 1 : 0
      y[i] = i === 0 ? e : e - (m[i] as number) * (y[i - 1] as number)
    }
    let x = (y[n - 1] as number) / (p[n - 1] as number)
    h[(n - 1) * n + col] = x
    for (let i = n - 2; i >= 0; i--) {
      x = ((y[i] as number) + (c[i] as number) * x) / (p[i] as number)
      h[i * n + col] = x
    }
  }
  return h
}
