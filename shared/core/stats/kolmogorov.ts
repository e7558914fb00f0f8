/**
 * Kolmogorov distribution K(x) = P(sup |B(t)| ≤ x) of the Brownian bridge supremum
 * (MODELS.md §0, §4.3: string INL yield), and its quantile x_K(Y).
 */

/** K(x) by the alternating series for x ≥ 1 and the Jacobi theta form for x < 1 (both to ~1e-16). */
export function kolmogorovCdf(x: number): number {
  if (!(x > 0)) {
    return 0
  }
  if (x >= 1) {
    let sum = 0
    for (let j = 1; j <= 100; j++) {
      const term = Math.exp(-2 * j * j * x * x)
      sum += (j % 2 === 1 ? 1 : -1) * term
      if (term < 1e-18) {
        break
      }
    }
    return 1 - 2 * sum
  }
  const c = (Math.PI * Math.PI) / (8 * x * x)
  let sum = 0
  for (let j = 1; j <= 100; j++) {
    const term = Math.exp(-(2 * j - 1) * (2 * j - 1) * c)
    sum += term
    if (term < 1e-18 * sum) {
      break
    }
  }
  return (Math.sqrt(2 * Math.PI) / x) * sum
}

/**
 * Kolmogorov quantile x_K(Y): the x with K(x) = Y, for Y in (0, 1), by bisection to 1e-13.
 * E.g. x_K(0.95) ≈ 1.3581, x_K(0.997) ≈ 1.8031.
 */
export function kolmogorovQuantile(yieldTarget: number): number {
  if (!(yieldTarget > 0 && yieldTarget < 1)) {
    throw new RangeError(`kolmogorovQuantile: yield must be in (0, 1), got ${yieldTarget}`)
  }
  let lo = 0.01
  let hi = 10
  while (hi - lo > 1e-13) {
    const mid = 0.5 * (lo + hi)
    if (kolmogorovCdf(mid) < yieldTarget) {
      lo = mid
    } else {
      hi = mid
    }
  }
  return 0.5 * (lo + hi)
}
