/**
 * Confidence intervals for a Monte Carlo yield (a binomial proportion).
 * The Wilson score interval is used: it behaves well near 0 and 1, where DAC yields live,
 * unlike the normal-approximation (Wald) interval, and needs no beta quantiles.
 */
import { normalQuantile } from './normal'

/** A yield estimate with its two-sided confidence interval (all fractions in [0, 1]). */
export interface YieldEstimate {
  passes: number
  trials: number
  yield: number
  low: number
  high: number
  confidence: number
}

/**
 * Wilson score interval for `passes` successes in `trials` Bernoulli trials.
 * @param confidence two-sided level, e.g. 0.95 (default)
 * Invariant: low ≤ passes/trials ≤ high, and 0 ≤ low ≤ high ≤ 1. With trials = 0 the yield is NaN.
 */
export function wilsonInterval(passes: number, trials: number, confidence = 0.95): YieldEstimate {
  if (trials <= 0) {
    return { passes, trials, yield: Number.NaN, low: 0, high: 1, confidence }
  }
  const z = normalQuantile(0.5 + confidence / 2)
  const p = passes / trials
  const z2n = (z * z) / trials
  const centre = (p + z2n / 2) / (1 + z2n)
  const half = (z / (1 + z2n)) * Math.sqrt((p * (1 - p)) / trials + z2n / (4 * trials))
  return {
    passes,
    trials,
    yield: p,
    low: Math.max(0, Math.min(p, centre - half)),
    high: Math.min(1, Math.max(p, centre + half)),
    confidence
  }
}
