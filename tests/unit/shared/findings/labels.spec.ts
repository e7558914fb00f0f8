import { describe, expect, it } from 'vitest'
import { FACT_FIELDS, FACTS } from '#shared/findings/fields'
import { conditionWords } from '#shared/findings/conditionWords'
import { factLabel, metricLabel } from '#shared/findings/labels'
import { BUILT_IN_PACKS } from '#shared/findings/registry'
import { IMPORT_COLUMNS } from '#shared/io/importColumns'

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

// The editor reads a stored condition back as a sentence (common practice, no source); every
// condition of the built-in pack must read without a camelCase contract name or operator.
describe('conditionWords', () => {
  it('reads a stored condition in the interface\'s words', () => {
    expect(conditionWords({ fact: 'metrics', path: '$.totalAreaMm2', operator: 'greaterThan', value: 0.01 })).toBe('Result: total area is above 0.01 mm²')
    expect(conditionWords({ all: [
      { fact: 'spec', path: '$.monotonicRequired', operator: 'equal', value: true },
      { fact: 'metrics', path: '$.unitWidthUm', operator: 'lessThan', value: { fact: 'process', path: '$.minWidthUm' } }
    ] })).toMatch(/^all of \(Target: .+ is yes; Result: unit width is below the process: .+\)$/)
  })

  it('reads every condition of the built-in pack without contract names', () => {
    for (const rule of BUILT_IN_PACKS[0]!.rules) {
      const text = conditionWords(rule.conditions)
      expect(text, rule.id).not.toMatch(/\$\.|\b[a-z]+[A-Z][a-zA-Z]*\b/)
    }
  })
})

describe('import column labels', () => {
  it('gives every CSV import column words of its own (shown on the import page)', () => {
    for (const c of IMPORT_COLUMNS) {
      const label = c.def?.label ?? metricLabel(c.key)
      expect(label, c.name).not.toBe(c.key)
    }
  })
})

describe('built-in rule texts', () => {
  it('name no contract field outside their placeholders', () => {
    for (const r of BUILT_IN_PACKS[0]!.rules) {
      for (const text of [r.title, r.explanation, r.action, r.threshold.note]) {
        expect(text.replace(/\{[^}]*\}/g, ''), r.id).not.toMatch(/\b[a-z]+[A-Z]\w*\b/)
      }
    }
  })
})
