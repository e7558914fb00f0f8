import { describe, expect, it } from 'vitest'
import { lineMargin } from '../../../utils/specLines'
import { areaForTarget, yieldLoss } from '../../../utils/yieldCurve'

describe('lineMargin', () => {
  it('is the headroom as a share of the limit, positive inside the spec', () => {
    // derived: (budget − value) / budget and (value − required) / required
    expect(lineMargin({ metric: 'totalAreaMm2', sense: 'max' }, 0.04, 0.05)).toBeCloseTo(0.2, 12)
    expect(lineMargin({ metric: 'maxUpdateRateHz', sense: 'min' }, 50e3, 100e3)).toBeCloseTo(-0.5, 12)
  })

  it('judges yield on what is lost: 99.85 % against a 99.7 % target keeps half the allowed loss', () => {
    // derived: allowed loss 0.3 %, loss 0.15 % → (0.3 − 0.15) / 0.3
    expect(lineMargin({ metric: 'yield', sense: 'min' }, 0.9985, 0.997)).toBeCloseTo(0.5, 9)
  })
})

describe('unit area for the target on the engine\'s yield curve', () => {
  // 2Φ(z) − 1 at z = 2, 3, 4 (standard normal table): 0.9545, 0.9973, 0.999937; with σ ∝ 1/√area
  // (Pelgrom) the margin z doubles when the area quadruples
  const curve = { unitAreaUm2: [1, 2.25, 4], yield: [0.9545, 0.9973, 0.999937] }
  it('returns a point of the curve exactly and the first area when it already meets the target', () => {
    expect(areaForTarget(curve, 0.9973)).toBeCloseTo(2.25, 9)
    expect(areaForTarget(curve, 0.9)).toBe(1)
  })
  it('interpolates log(loss) against log(area) in between, and says when no area reaches the target', () => {
    const a = areaForTarget(curve, 0.999)!
    // z = 3.2905 for 99.9 % (normal table) → area (3.2905/2)² = 2.707; log-log interpolation is first order: ±5 %
    expect(a).toBeGreaterThan(2.25)
    expect(Math.abs(a / 2.707 - 1)).toBeLessThan(0.05)
    expect(areaForTarget(curve, 0.9999999)).toBeNull()
    expect(yieldLoss(1)).toBe(1e-12)
  })
})
