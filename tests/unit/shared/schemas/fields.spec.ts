import { describe, expect, it } from 'vitest'
import { evaluateInputSchema, evaluateOptionsSchema, evaluateProcessSchema, evaluateSpecSchema } from '../../../../shared/core/contract/evaluate'
import { FIELDS, findField, sectionFields, type FieldDef } from '../../../../shared/schemas/fields'
import { fieldRange, fieldReadBack, readField, readSection, writeSection, type SectionEntries } from '../../../../shared/schemas/fieldValues'

const field = (section: FieldDef['section'], key: string): FieldDef => {
  const def = findField(section, key)
  if (!def) throw new Error(`no field ${section}.${key}`)
  return def
}

function read(section: FieldDef['section'], key: string, text: string) {
  return readField(field(section, key), text)
}

// The engine contract's field list as the issue fixes it (the names are the contract; no source needed beyond it).
const CONTRACT_FIELDS = {
  spec: ['bits', 'vrefV', 'updateRateHz', 'loadCapacitanceF', 'loadResistanceOhm', 'inlTargetLsb', 'dnlTargetLsb', 'yieldTarget', 'monotonicRequired', 'areaBudgetMm2', 'glitchLimitVs', 'refSourceOhm', 'powerBudgetW'],
  process: ['sheetOhmPerSq', 'matchingPctUm', 'matchingConvention', 'unitOhm', 'switchOhm', 'switchSkewS', 'switchChargeC', 'switchAreaUm2', 'gateAreaUm2', 'layoutOverhead', 'minWidthUm', 'minLengthUm', 'switchSpreadPct', 'switchMismatchPct'],
  options: ['topologies', 'trials', 'seed', 'inlDefinition', 'switchHandling']
}

describe('field catalogue', () => {
  it('has one entry for every spec, process and option field of the engine contract, each with label and help', () => {
    for (const [section, keys] of Object.entries(CONTRACT_FIELDS)) {
      expect(sectionFields(section as FieldDef['section']).map(f => f.key).sort()).toEqual([...keys].sort())
    }
    for (const def of FIELDS) {
      expect(def.label.length).toBeGreaterThan(2)
      expect(def.help.length).toBeGreaterThan(5)
    }
  })

  it('names only fields the engine schemas know', () => {
    const shapes = { spec: evaluateSpecSchema.shape, process: evaluateProcessSchema.shape, options: evaluateOptionsSchema.shape }
    for (const def of FIELDS) expect(Object.keys(shapes[def.section])).toContain(def.key)
  })

  it('reads its ranges from the engine schema rather than a copy', () => {
    expect(fieldRange(field('spec', 'vrefV'))).toEqual({ min: evaluateSpecSchema.shape.vrefV.minValue, max: evaluateSpecSchema.shape.vrefV.maxValue, minExclusive: false })
    expect(fieldRange(field('spec', 'glitchLimitVs'))?.minExclusive).toBe(true)
  })
})

describe('readField', () => {
  it('reads engineering notation into the contract unit', () => {
    expect(read('spec', 'vrefV', '2.5 V')).toEqual({ ok: true, value: 2.5 })
    expect(read('spec', 'updateRateHz', '1 MS/s')).toEqual({ ok: true, value: 1e6 })
    expect(read('spec', 'areaBudgetMm2', '0.02 mm^2')).toEqual({ ok: true, value: 0.02 })
    expect(read('spec', 'yieldTarget', '99.7 %')).toEqual({ ok: true, value: 0.997 })
    expect(read('process', 'matchingPctUm', '1 %·µm')).toEqual({ ok: true, value: 1 })
    expect(read('spec', 'bits', '12 bit')).toEqual({ ok: true, value: 12 })
  })

  it('refuses a wrong unit, naming the quantity and what was typed', () => {
    const r = read('spec', 'vrefV', '2 kohm')
    expect(r.ok).toBe(false)
    expect(r.ok ? '' : r.message).toBe('must be a voltage in V, e.g. 2.5 V (got "2 kohm")')
  })

  it('refuses an out-of-range value with the allowed range in the units shown', () => {
    const r = read('spec', 'vrefV', '60 V')
    expect(r.ok ? '' : r.message).toBe('must be from 100 mV to 50 V (got 60 V)')
    const g = read('spec', 'glitchLimitVs', '0 V*s')
    expect(g.ok ? '' : g.message).toBe('must be above 0 V·s and at most 1 mV·s (got 0 V·s)')
    const b = read('spec', 'bits', '40')
    expect(b.ok ? '' : b.message).toBe('must be an integer from 2 to 16 (got 40)')
  })

  it('takes "none" or nothing as no load resistance, and "auto" as an engine-sized unit resistor', () => {
    expect(read('spec', 'loadResistanceOhm', 'none')).toEqual({ ok: true, value: null })
    expect(read('spec', 'loadResistanceOhm', '')).toEqual({ ok: true, value: null })
    expect(read('process', 'unitOhm', 'auto')).toEqual({ ok: true, value: 'auto' })
    expect(read('process', 'unitOhm', '5 kΩ')).toEqual({ ok: true, value: 5000 })
  })
})

// SPICE3 user's manual scale factors (K = 1e3, MEG = 1e6, M = milli, P = 1e-12), from memory.
describe('readField with SPICE-style entries, shown back', () => {
  it('reads the spellings engineers type and shows the value read', () => {
    expect(read('process', 'unitOhm', '10k')).toEqual({ ok: true, value: 1e4 })
    expect(read('process', 'unitOhm', '4.7K')).toEqual({ ok: true, value: 4700 })
    expect(read('spec', 'loadResistanceOhm', '1meg')).toEqual({ ok: true, value: 1e6 })
    expect(read('spec', 'loadCapacitanceF', '10p')).toEqual({ ok: true, value: 10e-12 })
    expect(read('spec', 'vrefV', '2.5 v')).toEqual({ ok: true, value: 2.5 })
    expect(read('spec', 'glitchLimitVs', '50 pVs')).toEqual({ ok: true, value: 50e-12 })
    expect(read('spec', 'inlTargetLsb', '0.5 lsb')).toEqual({ ok: true, value: 0.5 })
    expect(fieldReadBack(field('process', 'unitOhm'), '10 Kohm')).toBe('10 kΩ')
    expect(fieldReadBack(field('spec', 'loadResistanceOhm'), '1meg')).toBe('1 MΩ')
    expect(fieldReadBack(field('spec', 'vrefV'), '500m')).toMatch(/^500 mV \(m read as milli/)
  })

  it('refuses a bare M and shows nothing back for words and unreadable text', () => {
    const r = read('spec', 'loadResistanceOhm', '1M')
    expect(r.ok ? '' : r.message).toMatch(/ambiguous: SPICE reads a bare M as milli, SI as mega/)
    expect(fieldReadBack(field('spec', 'loadResistanceOhm'), 'none')).toBeNull()
    expect(fieldReadBack(field('process', 'unitOhm'), 'auto')).toBeNull()
    expect(fieldReadBack(field('spec', 'vrefV'), '2.5 volts of joy')).toBeNull()
  })
})

describe('readSection and writeSection', () => {
  it('round-trips the engine defaults, and the result is a valid evaluate input', () => {
    const spec: SectionEntries = { ...writeSection('spec', {}), bits: '12', vrefV: '2.5 V', updateRateHz: '1 MS/s', loadCapacitanceF: '10 pF', inlTargetLsb: '0.5', dnlTargetLsb: '0.5 LSB', yieldTarget: '99.7 %', areaBudgetMm2: '0.05 mm²', glitchLimitVs: '10 pV·s', powerBudgetW: '1 mW' }
    const process: SectionEntries = { ...writeSection('process', {}), sheetOhmPerSq: '300 Ω/□', matchingPctUm: '0.8 %·µm', matchingConvention: 'pair' }
    const s = readSection('spec', spec)
    const p = readSection('process', process)
    const o = readSection('options', writeSection('options', {}))
    expect({ ...s.errors, ...p.errors, ...o.errors }).toEqual({})
    expect(evaluateInputSchema.safeParse({ spec: s.values, process: p.values, options: o.values }).success).toBe(true)
    expect(readSection('spec', writeSection('spec', s.values)).values).toEqual(s.values)
  })

  it('collects one error per bad field, keyed by field', () => {
    const { errors } = readSection('spec', { ...writeSection('spec', {}), vrefV: '2 kohm' })
    expect(Object.keys(errors)).toContain('vrefV')
    expect(Object.keys(errors)).toContain('bits')
  })
})
