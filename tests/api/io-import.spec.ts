import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { parse } from 'csv-parse/sync'
import type { StudyDocument } from '../../shared/io/studyDocument'
import type { RevisionDto } from '../../shared/types/revisions'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'

const HEADER = 'title,blockName,bits,vrefV,updateRateHz,loadCapacitanceF,inlTargetLsb,dnlTargetLsb,yieldTarget,areaBudgetMm2,glitchLimitVs,powerBudgetW,sheetOhmPerSq,matchingPctUm,matchingConvention,topologies,trials'
const row = (title: string, bits: string) => `${title},FAM-1,${bits},2.5 V,1 MS/s,10 pF,1 LSB,0.5,99.7 %,0.02 mm²,10 pV·s,1 mW,300 Ω/□,1 %·µm,pair,string;segmented,0`
const SPEC = { bits: 6, vrefV: 1.2, updateRateHz: 1e6, loadCapacitanceF: 1e-12, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }
const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }

let db: Knex
let engineer: string
let architect: string
let manager: string
let otherTeam: string
let teamId: number

const count = async (table: string) => Number((await db(table).count({ n: '*' }))[0]!.n)
type ImportAnswer = { studies: { id: number, title: string }[], message: string, data: { rows: { line: number, issues: { path: string, message: string }[] }[] } }
const importText = (text: string, cookie = engineer) => api<ImportAnswer>('/api/studies/import', { method: 'POST', cookie, body: { text, fileName: 'family.csv' } })

beforeAll(async () => {
  db = testDb()
  ;[engineer, architect, manager] = await Promise.all([signIn(DEMO.engineer), signIn(DEMO.architect), signIn(DEMO.manager)])
  teamId = (await db('teams').where({ slug: 'harrow-lake' }).first('id')).id
  const [otherId] = await db('teams').insert({ name: 'Import Other Works', slug: `import-other-${Date.now()}` })
  const email = `import-${Date.now()}@other.example`
  await db('users').insert({ team_id: otherId, email, display_name: 'Other Engineer', password_hash: await bcrypt.hash('other-team-pass', 4), role: 'engineer' })
  otherTeam = await signIn(email, 'other-team-pass')
})
afterAll(async () => {
  await db.destroy()
})

describe('spec import', () => {
  it('previews every row with its problems, and creates nothing when any row is bad', async () => {
    const text = `${HEADER}\n${row('Trim A', '10')}\n${row('Trim B', '40')}\n${row('Trim C', '12')}\n`
    const preview = await api<{ valid: boolean, rows: { line: number, issues: { path: string, message: string }[] }[] }>('/api/studies/import/preview', { method: 'POST', cookie: engineer, body: { text } })
    expect(preview.status).toBe(200)
    expect(preview.body.valid).toBe(false)
    expect(preview.body.rows.map(r => r.issues.length)).toEqual([0, 1, 0])
    expect(preview.body.rows[1]).toEqual({ line: 3, title: 'Trim B', blockName: 'FAM-1', inputs: null, issues: [{ path: 'spec.bits', message: 'must be an integer from 2 to 16 (got 40)' }] })
    const [studies, revisions, audit] = [await count('studies'), await count('study_revisions'), await count('audit_log')]
    const res = await importText(text)
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/^text: 1 of 3 rows have problems; nothing was created\. line 3: spec\.bits: must be an integer from 2 to 16/)
    expect(res.body.data.rows[1]!.issues[0]!.path).toBe('spec.bits')
    expect([await count('studies'), await count('study_revisions'), await count('audit_log')]).toEqual([studies, revisions, audit])
  })

  it('creates every study of a valid CSV with its first inputs-only revision, in the importer\'s team', async () => {
    const before = await count('studies')
    const res = await importText(`${HEADER}\n${row('Trim D', '10')}\n${row('Trim E', '12')}\n`, architect)
    expect(res.status).toBe(201)
    expect(res.body.studies.map(s => s.title)).toEqual(['Trim D', 'Trim E'])
    expect(await count('studies')).toBe(before + 2)
    const study = await db('studies').where({ id: res.body.studies[1]!.id }).first()
    expect(study).toMatchObject({ team_id: teamId, version: 1, block_name: 'FAM-1', status: 'draft' })
    const rev = await api<RevisionDto>(`/api/studies/${study.id}/revisions/1`, { cookie: manager })
    expect(rev.body).toMatchObject({ number: 1, hasResults: false, note: 'Imported from family.csv', spec: { bits: 12, updateRateHz: 1e6, yieldTarget: 0.997 }, process: { sheetOhmPerSq: 300, unitOhm: 'auto' }, options: { topologies: ['string', 'segmented'], trials: 0 } })
    expect(await db('audit_log').where({ action: 'study_imported', target_id: String(study.id) })).toHaveLength(1)
  })

  it('creates the studies of a JSON list', async () => {
    const res = await importText(JSON.stringify([{ title: 'JSON one', spec: SPEC, process: PROCESS }, { title: 'JSON two', blockName: 'B2', spec: { ...SPEC, bits: 8 }, process: PROCESS, options: { topologies: ['r2r-voltage'], trials: 0 } }]))
    expect(res.status).toBe(201)
    expect(res.body.studies).toHaveLength(2)
  })

  it('refuses a manager (403) and writes nothing', async () => {
    const before = await count('studies')
    expect((await importText(`${HEADER}\n${row('Manager try', '10')}\n`, manager)).status).toBe(403)
    expect((await api('/api/studies/import/preview', { method: 'POST', cookie: manager, body: { text: 'title\nA' } })).status).toBe(403)
    expect(await count('studies')).toBe(before)
  })

  it('answers a body without text with a field-named 400', async () => {
    const res = await api<{ message: string }>('/api/studies/import', { method: 'POST', cookie: engineer, body: { text: '' } })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/^text: /)
  })
})

describe('study export and comparison', () => {
  let studyId: number
  let results: Record<string, unknown> & { candidates: { id: string, metrics: Record<string, number | null> }[] }

  beforeAll(async () => {
    const created = await importText(JSON.stringify([{ title: '=Round trip', blockName: 'RT', spec: SPEC, process: PROCESS, options: { topologies: ['string', 'r2r-voltage', 'segmented'], trials: 200, seed: 3 } }]))
    studyId = created.body.studies[0]!.id
    // a second revision with the engine's own output for exactly its inputs (POST /api/evaluate)
    const inputs = { spec: { ...SPEC, vrefV: 1.8 }, process: PROCESS, options: { topologies: ['string', 'r2r-voltage', 'segmented'], trials: 200, seed: 3 } }
    const evaluated = await api<typeof results>('/api/evaluate', { method: 'POST', cookie: engineer, body: inputs })
    expect(evaluated.status).toBe(200)
    results = evaluated.body
    const saved = await api<RevisionDto>(`/api/studies/${studyId}/revisions`, { method: 'POST', cookie: engineer, body: { baseVersion: 1, ...inputs, note: 'Lower reference' } })
    expect(saved.status).toBe(201)
    await db('study_revisions').where({ study_id: studyId, number: 2 }).update({ results: JSON.stringify(results), engine_version: results.engineVersion })
  })

  const withoutIds = (d: StudyDocument) => ({ ...d, exportedAt: undefined, study: { ...d.study, id: undefined }, revisions: d.revisions.map(r => ({ ...r, createdAt: undefined })) })

  it('exports a versioned document that imports as a new study and exports the same again', async () => {
    const first = await api<StudyDocument>(`/api/studies/${studyId}/export`, { cookie: manager })
    expect(first.status).toBe(200)
    expect(first.headers.get('content-disposition')).toMatch(/^attachment; filename=".*\.rungwise\.json"$/)
    expect(first.body).toMatchObject({ format: 'rungwise-study', version: 1, study: { title: '=Round trip', blockName: 'RT' }, results: { revision: 2 } })
    expect(first.body.revisions.map(r => r.number)).toEqual([1, 2])
    const imported = await importText(JSON.stringify(first.body), architect)
    expect(imported.status).toBe(201)
    const newId = imported.body.studies[0]!.id
    expect(newId).not.toBe(studyId)
    const second = await api<StudyDocument>(`/api/studies/${newId}/export`, { cookie: engineer })
    expect(withoutIds(second.body)).toEqual(withoutIds(first.body))
    // the portfolio columns follow the imported results
    expect((await db('studies').where({ id: newId }).first('summary_candidate_count')).summary_candidate_count).toBe(results.candidates.length)
  })

  it('refuses a document of another version, naming the field', async () => {
    const doc = (await api<StudyDocument>(`/api/studies/${studyId}/export`, { cookie: engineer })).body
    const res = await importText(JSON.stringify({ ...doc, version: 2 }))
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/version: must be 1/)
  })

  it('writes the comparison as CSV with units in the headers and the engine\'s numbers', async () => {
    const res = await api<string>(`/api/studies/${studyId}/comparison`, { cookie: manager })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/)
    const rows = parse(res.body) as string[][]
    const header = rows[0]!
    expect(header.slice(0, 6)).toEqual(['candidate', 'topology', 'unaryBits', 'recommended', 'meetsSpec', 'failing'])
    expect(header).toEqual(expect.arrayContaining(['totalAreaMm2 (mm²)', 'inlSigmaLsb (LSB)', 'routMaxOhm (Ω)', 'settlingS (s)', 'glitchWorstVs (V·s)']))
    expect(rows.slice(1).map(r => r[0])).toEqual(results.candidates.map(c => c.id))
    const area = header.indexOf('totalAreaMm2 (mm²)')
    rows.slice(1).forEach((r, i) => expect(Number(r[area])).toBe(results.candidates[i]!.metrics.totalAreaMm2))
  })

  it('answers 409 for a revision without results, 404 for another team', async () => {
    const bare = await importText(JSON.stringify([{ title: 'Bare', spec: SPEC, process: PROCESS }]))
    const res = await api<{ message: string }>(`/api/studies/${bare.body.studies[0]!.id}/comparison`, { cookie: engineer })
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/inputs only/)
    expect((await api(`/api/studies/${studyId}/comparison`, { cookie: otherTeam })).status).toBe(404)
    expect((await api(`/api/studies/${studyId}/export`, { cookie: otherTeam })).status).toBe(404)
  })
})
