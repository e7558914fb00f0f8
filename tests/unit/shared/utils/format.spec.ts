import { describe, expect, it } from 'vitest'
import { formatNumber, formatSi } from '../../../../shared/utils/format'

// SI prefixes and engineering notation: the SI Brochure's prefix table (from memory for the symbols).
describe('formatSi', () => {
  it.each([
    [640e3, 'Ω', '640 kΩ'],
    [3.99e-6, 's', '3.99 µs'],
    [125e-12, 'V·s', '125 pV·s'],
    [1.024e6, 'Ω', '1.02 MΩ'],
    [2.5, 'V', '2.5 V'],
    [-12.87e-6, 'V', '-12.9 µV'],
    [0, 'A', '0 A']
  ])('writes %s %s as %s', (value, unit, expected) => {
    expect(formatSi(value, unit)).toBe(expected)
  })

  it('rounds up into the next prefix instead of printing 1000 k', () => {
    expect(formatSi(999_999, 'Ω')).toBe('1 MΩ')
  })

  it('shows a dash for missing or infinite values (a quantity that does not apply)', () => {
    expect(formatSi(null, 'Ω')).toBe('—')
    expect(formatSi(Infinity, 'Ω')).toBe('—')
    expect(formatNumber(Number.NaN)).toBe('—')
  })

  it('keeps more significant figures when asked (explain mode)', () => {
    expect(formatSi(3.9934e-6, 's', 5)).toBe('3.9934 µs')
    expect(formatNumber(0.0123456, 4)).toBe('0.01235')
  })
})
