import { describe, expect, it } from 'vitest'
import { FACT_FIELDS, FACTS } from '#shared/findings/fields'
import { factLabel, metricLabel } from '#shared/findings/labels'

// No internal names on screen (issue 14; common practice, no source): every field a rule can read
// has words of its own, which are never the camelCase contract name.
describe('fact labels', () => {
  it.each(FACTS)('gives every %s field a label in words', (fact) => {
    for (const field of FACT_FIELDS[fact]) {
      const label = factLabel(fact, field)
      expect(label, `${fact}.${field}`).not.toBe(field)
      expect(label, `${fact}.${field}`).not.toMatch(/[a-z][A-Z]/)
    }
  })

  it('reads basis entries with or without a fact', () => {
    expect(metricLabel('refSourceMaxOhm')).toBe('largest reference source resistance allowed')
    expect(metricLabel('derived.systematicDnlMinLsb')).toBe('most negative nominal DNL step (signed)')
    expect(metricLabel('sigmaForDnl')).toBe('σ of one unit the DNL target needs')
  })
})
