/** Smallest yield loss considered (a loss below one in 10^12 is taken as that). */
export const LOSS_FLOOR = 1e-12

/** The engine's analytic yield against unit area of one candidate (evaluate output: linearity.yieldAgainstArea). */
export interface YieldAreaCurve { unitAreaUm2: number[], yield: number[] }

/** Yield loss (1 − yield) as plotted, floored at LOSS_FLOOR. */
export function yieldLoss(y: number): number {
  return Math.max(LOSS_FLOOR, 1 - y)
}

/**
 * The unit area at which the engine's curve reaches the target yield: between the two
 * neighbouring areas the loss is interpolated linearly in log(loss) against log(area) (the
 * curve is smooth there); null when no area on the curve reaches the target.
 */
export function areaForTarget(curve: YieldAreaCurve, target: number): number | null {
  const { unitAreaUm2: a, yield: y } = curve
  const i = y.findIndex(v => v >= target)
  if (i < 0) return null
  if (i === 0) return a[0]!
  const l0 = Math.log(yieldLoss(y[i - 1]!))
  const l1 = Math.log(yieldLoss(y[i]!))
  const lt = Math.log(yieldLoss(target))
  const t = l1 === l0 ? 1 : (lt - l0) / (l1 - l0)
  return Math.exp(Math.log(a[i - 1]!) + t * (Math.log(a[i]!) - Math.log(a[i - 1]!)))
}
