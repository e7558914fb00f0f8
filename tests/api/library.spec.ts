import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PresetDto, TemplateDto } from '../../shared/types/library'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'

// Process values in the contract's units; invented for the test (no foundry data).
const PROCESS = { sheetOhmPerSq: 400, matchingPctUm: 1.2, matchingConvention: 'pair', unitOhm: 'auto', switchOhm: 60, switchSkewS: 50e-12, switchChargeC: 1e-15, switchAreaUm2: 3, gateAreaUm2: 2, layoutOverhead: 2, minWidthUm: 0.5, minLengthUm: 1 }
const SPEC = { bits: 10, vrefV: 1.2, updateRateHz: 1e6, loadCapacitanceF: 5e-12, inlTargetLsb: 1, dnlTargetLsb: 0.5, yieldTarget: 0.99, areaBudgetMm2: 0.02, glitchLimitVs: 20e-12, powerBudgetW: 1e-3 }

let db: Knex
let architect: string
let admin: string
let engineer: string
let manager: string
let otherTeam: string

beforeAll(async () => {
  db = testDb()
  ;[architect, admin, engineer, manager] = await Promise.all([signIn(DEMO.architect), signIn(DEMO.admin), signIn(DEMO.engineer), signIn(DEMO.manager)])
  const [teamId] = await db('teams').insert({ name: 'Library Other Works', slug: `lib-other-${Date.now()}` })
  const email = `lib-${Date.now()}@other.example`
  await db('users').insert({ team_id: teamId, email, display_name: 'Other Admin', password_hash: await bcrypt.hash('other-team-pass', 4), role: 'admin' })
  otherTeam = await signIn(email, 'other-team-pass')
})
afterAll(async () => {
  await db.destroy()
})

const count = async (table: string) => Number((await db(table).count({ n: '*' }))[0]!.n)
const audits = async (action: string, id: number) => db('audit_log').where({ action, target_id: String(id) })

describe.each([
  { kind: 'preset', path: '/api/presets', table: 'process_presets', body: { process: PROCESS }, change: { process: { ...PROCESS, switchOhm: 90 } } },
  { kind: 'template', path: '/api/templates', table: 'spec_templates', body: { spec: SPEC }, change: { spec: { ...SPEC, bits: 11 } } }
])('$path', ({ kind, path, table, body, change }) => {
  it('lists the demo data flagged as demo, to every role', async () => {
    const res = await api<(PresetDto | TemplateDto)[]>(path, { cookie: manager })
    expect(res.status).toBe(200)
    const demo = res.body.filter(p => p.isDemo)
    expect(demo.length).toBeGreaterThanOrEqual(2)
    expect(demo.every(p => /^Demo/.test(p.name))).toBe(true)
    const flagged = await db(table).where({ is_demo: true }).pluck('name')
    expect(demo.map(p => p.name).sort()).toEqual(expect.arrayContaining(flagged.sort()))
  })

  it('creates, edits with the current version, refuses a stale version (409) and deletes; one audit row per write', async () => {
    const created = await api<PresetDto & TemplateDto>(path, { method: 'POST', cookie: architect, body: { name: `Test ${kind} A`, ...body } })
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({ version: 1, isDemo: false, ...body })
    const id = created.body.id
    const edited = await api<PresetDto>(`${path}/${id}`, { method: 'PATCH', cookie: admin, body: { version: 1, ...change } })
    expect(edited.status).toBe(200)
    expect(edited.body).toMatchObject({ version: 2, ...change })
    const stale = await api<{ data: { currentVersion: number, message: string } }>(`${path}/${id}`, { method: 'PATCH', cookie: architect, body: { version: 1, name: 'Lost update' } })
    expect(stale.status).toBe(409)
    expect(stale.body.data.currentVersion).toBe(2)
    expect((await db(table).where({ id }).first()).name).toBe(`Test ${kind} A`)
    expect((await api(`${path}/${id}`, { method: 'DELETE', cookie: architect })).status).toBe(204)
    expect(await db(table).where({ id }).first()).toBeUndefined()
    for (const action of [`${kind}_created`, `${kind}_updated`, `${kind}_deleted`]) expect(await audits(action, id)).toHaveLength(1)
  })

  it('answers a taken name with 409 naming the field, and writes nothing', async () => {
    const first = await api<PresetDto>(path, { method: 'POST', cookie: architect, body: { name: `Dup ${kind}`, ...body } })
    expect(first.status).toBe(201)
    const before = await count(table)
    const again = await api<{ message: string }>(path, { method: 'POST', cookie: architect, body: { name: `Dup ${kind}`, ...body } })
    expect(again.status).toBe(409)
    expect(again.body.message).toMatch(/^name: /)
    expect(await count(table)).toBe(before)
  })

  it('answers a bad body with 400 naming the field and its range, and writes nothing', async () => {
    const before = await count(table)
    const bad = kind === 'preset' ? { process: { ...PROCESS, layoutOverhead: 50 } } : { spec: { ...SPEC, bits: 40 } }
    const res = await api<{ message: string, data: { issues: { path: string }[] } }>(path, { method: 'POST', cookie: admin, body: { name: `Bad ${kind}`, ...bad } })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(kind === 'preset' ? /process\.layoutOverhead: must be a finite number from 1 to 10/ : /spec\.bits: must be an integer from 2 to 16/)
    expect(await count(table)).toBe(before)
    expect((await api(path, { method: 'POST', cookie: admin, body: { ...body } })).status).toBe(400)
  })

  it('lets only admins and architects write (engineer and manager: 403, nothing written)', async () => {
    const before = await count(table)
    for (const cookie of [engineer, manager]) {
      expect((await api(path, { method: 'POST', cookie, body: { name: `Forbidden ${kind}`, ...body } })).status).toBe(403)
    }
    const any = (await api<PresetDto[]>(path, { cookie: admin })).body[0]!
    expect((await api(`${path}/${any.id}`, { method: 'PATCH', cookie: manager, body: { version: any.version, name: 'x' } })).status).toBe(403)
    expect((await api(`${path}/${any.id}`, { method: 'DELETE', cookie: engineer })).status).toBe(403)
    expect(await count(table)).toBe(before)
  })

  it('keeps teams apart: another team sees none of ours and gets 404 for our ids', async () => {
    const ours = (await api<PresetDto[]>(path, { cookie: admin })).body[0]!
    expect((await api<PresetDto[]>(path, { cookie: otherTeam })).body).toEqual([])
    expect((await api(`${path}/${ours.id}`, { method: 'PATCH', cookie: otherTeam, body: { version: ours.version, name: 'Taken over' } })).status).toBe(404)
    expect((await api(`${path}/${ours.id}`, { method: 'DELETE', cookie: otherTeam })).status).toBe(404)
    expect((await db(table).where({ id: ours.id }).first()).name).toBe(ours.name)
  })

  it('refuses all of it without a session (401)', async () => {
    expect((await api(path)).status).toBe(401)
    expect((await api(path, { method: 'POST', body: { name: 'x', ...body } })).status).toBe(401)
  })
})

describe('preset values', () => {
  it('keeps an engine-sized unit resistor as "auto" and a given one as ohms', async () => {
    const a = await api<PresetDto>('/api/presets', { method: 'POST', cookie: admin, body: { name: 'Auto unit', process: PROCESS } })
    expect(a.body.process.unitOhm).toBe('auto')
    expect((await db('process_presets').where({ id: a.body.id }).first()).unit_ohm).toBeNull()
    const b = await api<PresetDto>('/api/presets', { method: 'POST', cookie: admin, body: { name: 'Fixed unit', process: { ...PROCESS, unitOhm: 5000 } } })
    expect(b.body.process.unitOhm).toBe(5000)
  })
})
