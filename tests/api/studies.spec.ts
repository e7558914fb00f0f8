import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { StudyDto, StudyPage } from '../../shared/types/studies'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'

// The full engine spec (SI units); loadResistanceOhm, monotonicRequired and refSourceOhm take the engine defaults.
const SPEC = { bits: 12, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 10e-12, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.997, areaBudgetMm2: 0.05, glitchLimitVs: 50e-12, powerBudgetW: 1e-3 }

let db: Knex
let architect: string
let otherTeamCookie: string
let otherTeamStudyId: number

beforeAll(async () => {
  db = testDb()
  architect = await signIn(DEMO.architect)
  // A second team, arranged directly in the database, to prove team scoping.
  const [teamId] = await db('teams').insert({ name: 'Other Works', slug: `other-${Date.now()}` })
  const email = `arch-${Date.now()}@other.example`
  const [userId] = await db('users').insert({ team_id: teamId, email, display_name: 'Other Architect', password_hash: await bcrypt.hash('other-team-pass', 4), role: 'architect' })
  const studyIds = await db('studies').insert({ team_id: teamId, owner_id: userId, title: 'Other team secret study', spec: JSON.stringify(SPEC) })
  otherTeamStudyId = studyIds[0]!
  otherTeamCookie = await signIn(email, 'other-team-pass')
})
afterAll(async () => {
  await db.destroy()
})

async function studyCount(): Promise<number> {
  return Number((await db('studies').count({ n: '*' }))[0]!.n)
}

describe('studies API', () => {
  it('refuses every study route without a session (401)', async () => {
    expect((await api('/api/studies')).status).toBe(401)
    expect((await api('/api/studies', { method: 'POST', body: { title: 'x', spec: SPEC } })).status).toBe(401)
    expect((await api('/api/studies/1')).status).toBe(401)
  })

  it('lists only the team\'s own studies, newest first, paginated', async () => {
    const res = await api<StudyPage>('/api/studies?pageSize=2', { cookie: architect })
    expect(res.status).toBe(200)
    expect(res.body.items).toHaveLength(2)
    expect(res.body.total).toBeGreaterThanOrEqual(3)
    const all = await api<StudyPage>('/api/studies?pageSize=100', { cookie: architect })
    expect(all.body.items.map(s => s.title)).not.toContain('Other team secret study')
    const other = await api<StudyPage>('/api/studies', { cookie: otherTeamCookie })
    expect(other.body.items.map(s => s.title)).toEqual(['Other team secret study'])
  })

  it('creates a study, returns it with 201 and shows it first in the list', async () => {
    const res = await api<StudyDto>('/api/studies', { method: 'POST', cookie: architect, body: { title: 'Created by the API test', blockName: 'Test block', spec: SPEC } })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ title: 'Created by the API test', status: 'draft', version: 0, spec: SPEC, owner: { name: 'Tomas Reyne' } })
    const list = await api<StudyPage>('/api/studies', { cookie: architect })
    expect(list.body.items[0]!.id).toBe(res.body.id)
    const read = await api<StudyDto>(`/api/studies/${res.body.id}`, { cookie: architect })
    expect(read.body.spec).toMatchObject({ ...SPEC, loadResistanceOhm: null, monotonicRequired: true, refSourceOhm: 0 })
    const audit = await db('audit_log').where({ action: 'study_created', target_id: String(res.body.id) }).first()
    expect(audit).toBeTruthy()
  })

  it.each([
    ['a missing title', { spec: SPEC }, 'title'],
    ['a title over 200 characters', { title: 'x'.repeat(201), spec: SPEC }, 'title'],
    ['bits out of range', { title: 'ok', spec: { ...SPEC, bits: 40 } }, 'spec.bits'],
    ['a negative reference voltage', { title: 'ok', spec: { ...SPEC, vrefV: -1 } }, 'spec.vrefV'],
    ['a yield given as text', { title: 'ok', spec: { ...SPEC, yieldTarget: '0.99' } }, 'spec.yieldTarget'],
    ['an unknown field', { title: 'ok', spec: SPEC, ownerId: 1 }, 'ownerId']
  ])('answers %s with 400 naming the field and writes nothing', async (_label, body, field) => {
    const before = await studyCount()
    const res = await api<{ data: { issues: { path: string, message: string }[] } }>('/api/studies', { method: 'POST', cookie: architect, body })
    expect(res.status).toBe(400)
    expect(res.body.data.issues.map(i => i.path)).toContain(field)
    expect(await studyCount()).toBe(before)
  })

  it('answers malformed JSON with 400, not 500', async () => {
    const res = await api('/api/studies', { method: 'POST', cookie: architect, body: '{"title": ', headers: { 'content-type': 'application/json' } })
    expect(res.status).toBe(400)
  })

  it('forbids a manager from creating studies (403) but lets them read', async () => {
    const manager = await signIn(DEMO.manager)
    const before = await studyCount()
    expect((await api('/api/studies', { method: 'POST', cookie: manager, body: { title: 'PM study', spec: SPEC } })).status).toBe(403)
    expect(await studyCount()).toBe(before)
    expect((await api('/api/studies', { cookie: manager })).status).toBe(200)
  })

  it('answers another team\'s study id with 404, like a missing one', async () => {
    expect((await api(`/api/studies/${otherTeamStudyId}`, { cookie: architect })).status).toBe(404)
    expect((await api('/api/studies/999999', { cookie: architect })).status).toBe(404)
    expect((await api(`/api/studies/${otherTeamStudyId}`, { cookie: otherTeamCookie })).status).toBe(200)
  })

  it('answers a non-numeric id and a bad page size with 400', async () => {
    expect((await api('/api/studies/abc', { cookie: architect })).status).toBe(400)
    const res = await api<{ message: string }>('/api/studies?pageSize=1000', { cookie: architect })
    expect(res.status).toBe(400)
    expect(res.body.message).toContain('pageSize: must be an integer from 1 to 100')
  })

  it('refuses a state-changing request sent from another site (403)', async () => {
    const res = await api('/api/studies', { method: 'POST', cookie: architect, body: { title: 'csrf', spec: SPEC }, headers: { origin: 'http://evil.example' } })
    expect(res.status).toBe(403)
  })
})
