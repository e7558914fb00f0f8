import { describe, expect, it } from 'vitest'
import { importIsValid, readSpecCsv, readSpecImport, readSpecJson } from '#shared/io/specImport'

const HEADER = 'title,block,bits,vrefV,updateRateHz,loadCapacitanceF,inlTargetLsb,dnlTargetLsb,yieldTarget,areaBudgetMm2,glitchLimitVs,powerBudgetW,sheetOhmPerSq,matchingPctUm,matchingConvention,topologies,trials'
const GOOD = 'Audio trim,TRIM-A,10,2.5 V,1 MS/s,10 pF,1 LSB,0.5,99.7 %,0.02 mm²,10 pV·s,1 mW,300 Ω/□,1 %·µm,pair,string;segmented,500'

describe('readSpecCsv', () => {
  it('reads units the way the form does and fills the engine defaults', () => {
    const p = readSpecCsv(`# family of trims\n${HEADER}\n${GOOD}\n`)
    expect(p.fileIssues).toEqual([])
    expect(importIsValid(p)).toBe(true)
    const row = p.rows[0]!
    expect(row).toMatchObject({ line: 3, title: 'Audio trim', blockName: 'TRIM-A', issues: [] })
    // unit conversions by the definitions of the SI prefixes (derived)
    expect(row.inputs!.spec).toMatchObject({ bits: 10, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, yieldTarget: 0.997, areaBudgetMm2: 0.02, glitchLimitVs: 1e-11, powerBudgetW: 1e-3, refSourceOhm: 0 })
    expect(row.inputs!.process).toMatchObject({ sheetOhmPerSq: 300, matchingPctUm: 1, matchingConvention: 'pair', unitOhm: 'auto' })
    expect(row.inputs!.options).toMatchObject({ topologies: ['string', 'segmented'], trials: 500, seed: 1 })
  })

  it('names the field, its allowed range and the line of each bad row', () => {
    const p = readSpecCsv(`${HEADER}\n${GOOD}\nToo fine,X,40,2.5 kΩ,1 MS/s,10 pF,1,0.5,99.7 %,0.02,10 pV·s,1 mW,300,1,pair,string,500\n,,10,2.5,1e6,1e-11,1,0.5,0.99,0.02,1e-11,1e-3,300,1,sideways,,`)
    expect(importIsValid(p)).toBe(false)
    expect(p.rows[0]!.issues).toEqual([])
    expect(p.rows[1]!.line).toBe(3)
    expect(p.rows[1]!.issues).toEqual(expect.arrayContaining([
      { path: 'spec.bits', message: 'must be an integer from 2 to 16 (got 40)' },
      { path: 'spec.vrefV', message: 'must be a voltage in V, e.g. 2.5 V (got "2.5 kΩ")' }
    ]))
    expect(p.rows[2]!.issues.map(i => i.path)).toEqual(expect.arrayContaining(['title', 'process.matchingConvention']))
  })

  it('refuses unknown columns and a file without rows', () => {
    expect(readSpecCsv('title,colour\nA,red').fileIssues[0]!.message).toMatch(/column "colour" is not a field/)
    expect(readSpecCsv(HEADER).fileIssues[0]!.message).toMatch(/no spec lines/)
    expect(readSpecCsv('bits\n10').fileIssues[0]!.message).toMatch(/title/)
  })

  it('says what is missing when a required field is left empty', () => {
    const p = readSpecCsv('title,bits\nBare,8')
    expect(p.rows[0]!.issues).toEqual(expect.arrayContaining([{ path: 'spec.vrefV', message: expect.stringMatching(/^is missing; it must be a finite number from 0.1 to 50/) }]))
  })
})

describe('readSpecJson', () => {
  const spec = { bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }
  const process = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }
  it('reads a list or { studies } of contract values', () => {
    expect(importIsValid(readSpecJson(JSON.stringify([{ title: 'A', spec, process }])))).toBe(true)
    expect(readSpecImport(JSON.stringify({ studies: [{ title: 'A', spec, process }, { title: 'B', spec: { ...spec, bits: 1 }, process }] })).rows[1]!.issues)
      .toEqual([{ path: 'spec.bits', message: 'must be an integer from 2 to 16 (got 1)' }])
  })
  it('refuses what is not a list of specs', () => {
    expect(readSpecJson('{"a":').fileIssues[0]!.message).toMatch(/not valid JSON/)
    expect(readSpecJson('[]').fileIssues[0]!.message).toMatch(/from 1 to 200/)
    expect(readSpecJson('{"format":"other"}').fileIssues[0]).toMatchObject({ path: 'format' })
  })
})
