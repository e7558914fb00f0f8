import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'
import { matrixPack } from './authorization-rule-packs'

interface Pack { id: number, packId: string, version: number, enabled: boolean, ruleCount: number }
interface Finding { ruleId: string, packId: string, packVersion: number, candidateId: string, explanation: string }

const EVALUATE = {
  spec: { bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 },
  process: { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' },
  options: { topologies: ['r2r-voltage', 'string'], trials: 0, seed: 1 }
}

let db: Knex
let admin: string
let engineer: string
let otherAdmin: string
beforeAll(async () => {
  db = testDb()
  admin = await signIn(DEMO.admin)
  engineer = await signIn(DEMO.engineer)
  const [teamId] = await db('teams').insert({ name: 'Rule pack other team', slug: `rp-other-${Date.now()}` })
  const email = `rp-${Date.now()}@other.example`
  await db('users').insert({ team_id: teamId, email, display_name: 'Other admin', password_hash: await bcrypt.hash('rp-other-pass', 4), role: 'admin' })
  otherAdmin = await signIn(email, 'rp-other-pass')
})
afterAll(async () => {
  await db.destroy()
})

const counts = async () => ({
  packs: Number((await db('rule_packs').count({ n: '*' }))[0]!.n),
  versions: Number((await db('rule_pack_versions').count({ n: '*' }))[0]!.n),
  audit: Number((await db('audit_log').where('target_type', 'rule_pack').count({ n: '*' }))[0]!.n)
})

async function create(enabled = false) {
  const res = await api<Pack>('/api/rule-packs', { method: 'POST', cookie: admin, body: { pack: matrixPack('api'), enabled } })
  expect(res.status).toBe(201)
  return res.body
}

describe('team rule packs', () => {
  it('creates a pack at version 1 with one history row and an audit row', async () => {
    const before = await counts()
    const pack = await create()
    expect(pack).toMatchObject({ version: 1, enabled: false, ruleCount: 1 })
    expect(await counts()).toEqual({ packs: before.packs + 1, versions: before.versions + 1, audit: before.audit + 1 })
    const history = await api<{ version: number, change: string }[]>(`/api/rule-packs/${pack.id}/history`, { cookie: engineer })
    expect(history.body.map(h => h.change)).toEqual(['created'])
  })

  it('answers a stale version with 409 and changes nothing; the current version saves and bumps it', async () => {
    const pack = await create()
    const ok = await api<Pack>(`/api/rule-packs/${pack.id}`, { method: 'PATCH', cookie: admin, body: { version: 1, enabled: true } })
    expect(ok.status).toBe(200)
    expect(ok.body).toMatchObject({ version: 2, enabled: true })
    const before = await counts()
    const stale = await api<{ message: string, data: { currentVersion: number } }>(`/api/rule-packs/${pack.id}`, { method: 'PATCH', cookie: admin, body: { version: 1, enabled: false } })
    expect(stale.status).toBe(409)
    expect(stale.body.message).toContain('version')
    expect(stale.body.data.currentVersion).toBe(2)
    expect(await counts()).toEqual(before)
    expect((await db('rule_packs').where({ id: pack.id }).first('enabled')).enabled).toBeTruthy()
  })

  it('refuses writes by a non-admin with 403 and writes nothing', async () => {
    const pack = await create()
    const before = await counts()
    expect((await api('/api/rule-packs', { method: 'POST', cookie: engineer, body: { pack: matrixPack('eng') } })).status).toBe(403)
    expect((await api(`/api/rule-packs/${pack.id}`, { method: 'PATCH', cookie: engineer, body: { version: 1, enabled: true } })).status).toBe(403)
    expect(await counts()).toEqual(before)
  })

  it('answers 404 for another team\'s pack, to read, edit or dry-run', async () => {
    const pack = await create()
    expect((await api(`/api/rule-packs/${pack.id}`, { cookie: otherAdmin })).status).toBe(404)
    expect((await api(`/api/rule-packs/${pack.id}`, { method: 'PATCH', cookie: otherAdmin, body: { version: 1, enabled: true } })).status).toBe(404)
    expect((await api(`/api/rule-packs/${pack.id}/dry-run`, { method: 'POST', cookie: otherAdmin, body: {} })).status).toBe(404)
  })

  it('refuses a broken pack with 400 naming the rule and the field, and writes nothing', async () => {
    const before = await counts()
    const bad = matrixPack('bad')
    bad.rules[0]!.conditions.all[0]!.path = '$.areaMm2'
    const res = await api<{ message: string }>('/api/rule-packs', { method: 'POST', cookie: admin, body: { pack: bad } })
    expect(res.status).toBe(400)
    expect(res.body.message).toContain('pack.rules[0].conditions.all[0].path')
    expect(res.body.message).toContain('rule "area-any"')
    expect(await counts()).toEqual(before)
    expect((await api('/api/rule-packs', { method: 'POST', cookie: admin, body: '{"pack":' })).status).toBe(400)
  })

  // Issue 13, finding 9: 28 nested `not` levels tripped the database's JSON depth check and about
  // 700 overflowed validation, both 500s. Depths from 9 (just past the bound) to 1,500.
  it.each([9, 28, 700, 1500])('refuses conditions nested %i levels deep with 400 naming the field, and writes nothing', async (depth) => {
    const before = await counts()
    const deep = matrixPack(`deep-${depth}`)
    const leaf = deep.rules[0]!.conditions.all[0]!
    let condition: unknown = leaf
    for (let i = 1; i < depth; i++) condition = { not: condition }
    const body = { pack: { ...deep, rules: [{ ...deep.rules[0]!, conditions: { all: [condition] } }] } }
    for (const route of ['/api/rule-packs', '/api/rule-packs/dry-run']) {
      const res = await api<{ message: string }>(route, { method: 'POST', cookie: admin, body })
      expect(res.status, route).toBe(400)
      expect(res.body.message).toContain('pack.rules[0].conditions')
      expect(res.body.message).toContain('at most 8 levels')
    }
    expect(await counts()).toEqual(before)
  })

  it('dry-runs a draft against the sample study and says which rules fire where', async () => {
    const res = await api<{ fired: Record<string, string[]>, candidateCount: number, sample: string }>('/api/rule-packs/dry-run', { method: 'POST', cookie: admin, body: { pack: matrixPack('dry') } })
    expect(res.status).toBe(200)
    expect(res.body.sample).toBe('sample')
    // every candidate has an area above 0, so the rule fires on all of them
    expect(res.body.fired['area-any']!.length).toBe(res.body.candidateCount)
  })

  it('applies an enabled team pack to evaluations and records its id and version', async () => {
    const pack = await create(true)
    const res = await api<{ findings: Finding[], rulePacks: { id: string, version: number }[] }>('/api/evaluate', { method: 'POST', cookie: engineer, body: EVALUATE })
    expect(res.status).toBe(200)
    expect(res.body.rulePacks).toContainEqual(expect.objectContaining({ id: pack.packId, version: 1 }))
    expect(res.body.rulePacks[0]).toMatchObject({ id: 'rungwise-core' })
    const mine = res.body.findings.filter(f => f.packId === pack.packId)
    expect(mine.map(f => f.candidateId).sort()).toEqual(['r2r-voltage', 'string-direct', 'string-tree'])
    expect(mine[0]!.explanation).toMatch(/^Area \d/)
    await api(`/api/rule-packs/${pack.id}`, { method: 'PATCH', cookie: admin, body: { version: 1, enabled: false } })
  })
})
