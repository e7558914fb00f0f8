import { describe, expect, it } from 'vitest'
import { studyCreateSchema, studyListQuerySchema } from '../../../../shared/schemas/study'

// The full engine spec (SI units); loadResistanceOhm, monotonicRequired and refSourceOhm have defaults.
const SPEC = { bits: 12, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 10e-12, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.997, areaBudgetMm2: 0.05, glitchLimitVs: 50e-12, powerBudgetW: 1e-3 }

function issues(value: unknown) {
  const r = studyCreateSchema.safeParse(value)
  return r.success ? [] : r.error.issues.map(i => `${i.path.join('.')}: ${i.message}`)
}

describe('study schema (shared by the form and POST /api/studies)', () => {
  it('accepts a complete study, trims the title and fills the engine defaults', () => {
    const r = studyCreateSchema.parse({ title: '  Trim DAC  ', spec: SPEC })
    expect(r.title).toBe('Trim DAC')
    expect(r.spec).toMatchObject({ loadResistanceOhm: null, monotonicRequired: true, refSourceOhm: 0 })
  })

  it('names the field and its allowed range in every message', () => {
    expect(issues({ title: 'x', spec: { ...SPEC, bits: 17 } })).toEqual(['spec.bits: must be an integer from 2 to 16 (got 17)'])
    expect(issues({ title: 'x', spec: { ...SPEC, dnlTargetLsb: 1 } })).toEqual(['spec.dnlTargetLsb: must be a finite number from 0.01 to 0.999 (LSB) (got 1)'])
    expect(issues({ title: 'x', spec: { ...SPEC, glitchLimitVs: undefined } })[0]).toMatch(/^spec.glitchLimitVs: is missing/)
    expect(issues({ title: '', spec: SPEC })).toEqual(['title: is required, 1 to 200 characters'])
  })

  it('rejects non-finite numbers and numbers sent as text', () => {
    expect(issues({ title: 'x', spec: { ...SPEC, vrefV: Number.POSITIVE_INFINITY } })).toHaveLength(1)
    expect(issues({ title: 'x', spec: { ...SPEC, vrefV: Number.NaN } })).toHaveLength(1)
    expect(issues({ title: 'x', spec: { ...SPEC, vrefV: '2.5' } })).toHaveLength(1)
  })

  it('rejects unknown fields instead of silently dropping them', () => {
    expect(issues({ title: 'x', spec: { ...SPEC, bitz: 3 } })[0]).toMatch(/^spec: is not a known field \(allowed: bits, /)
    expect(issues({ title: 'x' })[0]).toMatch(/^spec: must be a JSON object/)
  })

  it('coerces and bounds list paging from the query string', () => {
    expect(studyListQuerySchema.parse({ page: '3' })).toEqual({ page: 3, pageSize: 25 })
    expect(studyListQuerySchema.safeParse({ pageSize: '101' }).success).toBe(false)
    expect(studyListQuerySchema.safeParse({ page: '1.5' }).success).toBe(false)
  })
})
