import { describe, expect, it } from 'vitest'
import { lineMargin } from '../../../utils/specLines'
import { areaForYield, lossAtArea } from '../../../utils/yieldCurve'

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

describe('yield against unit area', () => {
  it('passes through the candidate\'s own yield at its sized area', () => {
    expect(1 - lossAtArea(4, 0.997, 4)).toBeCloseTo(0.997, 9)
  })

  it('needs four times the area for twice the margin in σ (Pelgrom: σ ∝ 1/√area)', () => {
    // 2Φ(z) − 1 = 0.9545 at z = 2 and 0.999937 at z = 4 (standard normal table)
    expect(areaForYield(1, 0.9545, 0.999937)).toBeCloseTo(4, 1)
    expect(1 - lossAtArea(1, 0.9545, 4)).toBeCloseTo(0.999937, 5)
  })
})
