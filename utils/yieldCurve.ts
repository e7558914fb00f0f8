import { normalUpperTail, twoSidedFactor } from '#shared/core/stats/normal'

/** Smallest yield loss considered (a loss below one in 10^12 is taken as that). */
export const LOSS_FLOOR = 1e-12

/** The equivalent two-sided Gaussian margin, in σ, of a yield: Y = 2Φ(z) − 1. */
export function equivalentMargin(yieldValue: number): number {
  return twoSidedFactor(Math.min(Math.max(yieldValue, 1e-9), 1 - LOSS_FLOOR))
}

/**
 * Yield loss (1 − yield) at another unit area by Pelgrom's area law (mismatch σ ∝ 1/√area): the
 * candidate's own analytic yield at its sized area A0 is read as a margin z0, z(A) = z0·√(A/A0),
 * and the loss is 2·Q(z). A first-order estimate for the chart only; the table's yield is the engine's.
 */
export function lossAtArea(a0Um2: number, y0: number, aUm2: number): number {
  return Math.max(LOSS_FLOOR, 2 * normalUpperTail(equivalentMargin(y0) * Math.sqrt(aUm2 / a0Um2)))
}

/** The unit area at which the same estimate reaches the target yield. */
export function areaForYield(a0Um2: number, y0: number, target: number): number {
  const z0 = equivalentMargin(y0)
  return z0 > 0 ? a0Um2 * (equivalentMargin(target) / z0) ** 2 : Infinity
}
