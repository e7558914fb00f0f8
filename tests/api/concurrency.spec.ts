import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'
import { matrixPack } from './authorization-rule-packs'
import { SPEC } from './fuzz-table'

/**
 * Optimistic concurrency on every editable record: two editors who both saw version 1 save at the
 * same moment, and exactly one wins (200), the other gets 409 with the current version; a delete
 * that names a stale version is refused the same way. (Study revisions: tests/api/revisions.spec.ts.)
 */
const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }
let db: Knex
let admin = ''
let architect = ''

beforeAll(async () => {
  db = testDb()
  ;[admin, architect] = await Promise.all([signIn(DEMO.admin), signIn(DEMO.architect)])
})
afterAll(async () => {
  await db.destroy()
})

describe.each([
  { kind: 'preset', path: '/api/presets', table: 'process_presets', content: { process: PROCESS } },
  { kind: 'template', path: '/api/templates', table: 'spec_templates', content: { spec: SPEC } }
])('$kind versions', ({ kind, path, table, content }) => {
  it('lets one of two simultaneous edits of the same version win; the other gets 409', async () => {
    const created = await api<{ id: number }>(path, { method: 'POST', cookie: admin, body: { name: `Race ${kind} ${Date.now()}`, ...content } })
    const id = created.body.id
    const [a, b] = await Promise.all([
      api(`${path}/${id}`, { method: 'PATCH', cookie: admin, body: { version: 1, description: 'edit A' } }),
      api(`${path}/${id}`, { method: 'PATCH', cookie: architect, body: { version: 1, description: 'edit B' } })
    ])
    expect([a.status, b.status].sort()).toEqual([200, 409])
    const loser = (a.status === 409 ? a : b).body as { data: { currentVersion: number } }
    expect(loser.data.currentVersion).toBe(2)
    const row = await db(table).where({ id }).first('version', 'description')
    expect(row.version).toBe(2)
    expect(row.description).toBe(a.status === 200 ? 'edit A' : 'edit B')
  })

  it('refuses a delete naming a stale version (409, nothing deleted) and deletes at the current one', async () => {
    const id = (await api<{ id: number }>(path, { method: 'POST', cookie: admin, body: { name: `Stale delete ${kind} ${Date.now()}`, ...content } })).body.id
    expect((await api(`${path}/${id}`, { method: 'PATCH', cookie: admin, body: { version: 1, description: 'changed' } })).status).toBe(200)
    const stale = await api<{ message: string, data: { currentVersion: number } }>(`${path}/${id}?version=1`, { method: 'DELETE', cookie: architect })
    expect(stale.status).toBe(409)
    expect(stale.body.message).toMatch(/^version: /)
    expect(stale.body.data.currentVersion).toBe(2)
    expect(await db(table).where({ id }).first('id')).toBeTruthy()
    expect((await api(`${path}/${id}?version=2`, { method: 'DELETE', cookie: architect })).status).toBe(204)
    expect(await db(table).where({ id }).first('id')).toBeUndefined()
  })
})

describe('rule pack versions', () => {
  it('lets one of two simultaneous saves of version 1 win; the other gets 409', async () => {
    const id = (await api<{ id: number }>('/api/rule-packs', { method: 'POST', cookie: admin, body: { pack: matrixPack('race') } })).body.id
    const [a, b] = await Promise.all([
      api(`/api/rule-packs/${id}`, { method: 'PATCH', cookie: admin, body: { version: 1, enabled: true } }),
      api(`/api/rule-packs/${id}`, { method: 'PATCH', cookie: admin, body: { version: 1, enabled: true } })
    ])
    expect([a.status, b.status].sort()).toEqual([200, 409])
    expect((await db('rule_packs').where({ id }).first('version')).version).toBe(2)
    expect(await db('rule_pack_versions').where({ rule_pack_id: id }).count({ n: '*' })).toEqual([{ n: 2 }])
  })
})
