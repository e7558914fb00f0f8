import { describe, expect, it } from 'vitest'
import { withFieldLabels } from '../../../utils/readableText'

// No internal names on screen (issue 14; common practice, no source).
describe('withFieldLabels', () => {
  it('puts labels in place of contract names in engine text, and leaves other words alone', () => {
    expect(withFieldLabels('Two-stage buffered strings assume offset-free buffers (process.bufferOffsetSigmaV = 0); real offsets add.'))
      .toBe('Two-stage buffered strings assume offset-free buffers (σ of buffer offset = 0); real offsets add.')
    expect(withFieldLabels('check metrics.unitOhm; tauS uses R_fb = R')).toBe('check unit resistor value; output time constant uses R_fb = R')
    expect(withFieldLabels('I-V amplifier, R-2R, iPhone-like words stay')).toBe('I-V amplifier, R-2R, iPhone-like words stay')
  })
})
