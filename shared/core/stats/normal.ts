/**
 * Standard normal distribution: CDF, upper tail and quantile.
 * Φ uses Marsaglia's Taylor series (J. Stat. Softw. 11(4), 2004) for |x| < 3 and the
 * Laplace continued fraction for the tail, evaluated with the modified Lentz method;
 * the quantile comes from the stdlib package (well-known, tested to near machine precision).
 */
import quantile from '@stdlib/stats-base-dists-normal-quantile'

const LOG_SQRT_2PI = 0.9189385332046728

/** Standard normal density φ(x). */
export function normalPdf(x: number): number {
  return Math.exp(-0.5 * x * x - LOG_SQRT_2PI)
}

/** Upper tail Q(x) = 1 − Φ(x) for x ≥ 3 by continued fraction (relative error ~1e-15). */
function upperTailCf(x: number): number {
  const tiny = 1e-300
  let f = x
  let c = x
  let d = 0
  for (let k = 1; k < 500; k++) {
    d = x + k * d
    d = Math.abs(d) < tiny ? tiny : d
    c = x + k / c
    c = Math.abs(c) < tiny ? tiny : c
    d = 1 / d
    const delta = c * d
    f *= delta
    if (Math.abs(delta - 1) < 1e-16) {
      break
    }
  }
  return normalPdf(x) / f
}

/** Φ(x) for |x| < 3 by Marsaglia's series Φ = ½ + φ(x)(x + x³/3 + x⁵/15 + …). */
function cdfSeries(x: number): number {
  const q = x * x
  let s = x
  let term = x
  let prev = 0
  for (let i = 3; s !== prev; i += 2) {
    prev = s
    term *= q / i
    s += term
  }
  return 0.5 + s * normalPdf(x)
}

/** Standard normal CDF Φ(x); accurate in relative terms in both tails. */
export function normalCdf(x: number): number {
  if (Number.isNaN(x)) {
    return Number.NaN
  }
  if (x <= -3) {
    return x < -40 ? 0 : upperTailCf(-x)
  }
  if (x >= 3) {
    return x > 40 ? 1 : 1 - upperTailCf(x)
  }
  return cdfSeries(x)
}

/** Upper tail Q(x) = 1 − Φ(x) = Φ(−x), accurate for large x. */
export function normalUpperTail(x: number): number {
  return normalCdf(-x)
}

/** Standard normal quantile Φ⁻¹(p) for p in (0, 1). */
export function normalQuantile(p: number): number {
  return quantile(p, 0, 1)
}

/** Two-sided Gaussian factor C = Φ⁻¹((1 + Y)/2) for a yield Y in (0, 1) (MODELS.md §4.3). */
export function twoSidedFactor(yieldTarget: number): number {
  return normalQuantile((1 + yieldTarget) / 2)
}
