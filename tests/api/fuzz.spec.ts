import { createHash, randomBytes } from 'node:crypto'
import fc from 'fast-check'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { testDb } from '../support/db'
import { applyMutation, encodeParam, mutationOf, nastyParam, queryMutationOf } from '../support/fuzz'
import { api, DEMO, signIn } from '../support/http'
import { routesOnDisk } from '../support/routes'
import { matrixPack } from './authorization-rule-packs'
import { FUZZ_TABLE, SPEC, type FuzzFixtures, type FuzzRow, type FuzzSample } from './fuzz-table'

/**
 * Property: whatever the body, query or path parameter, a route answers 2xx or 4xx (never 5xx),
 * within REQUEST_BOUND_MS, a 400 names the field it refuses, and a refused request leaves the
 * route's tables exactly as they were (CHECKSUM TABLE before and after). Seeded: FUZZ_SEED=<n>
 * replays a run; fast-check prints the seed and the shrunk counterexample on failure.
 */
const SEED = Number(process.env.FUZZ_SEED ?? Date.now() % 2 ** 31)
const RUNS = Number(process.env.FUZZ_RUNS ?? 40)
const REQUEST_BOUND_MS = 20_000

let db: Knex
let adminCookie = ''
let attemptsBefore = 0
const f = {} as FuzzFixtures

beforeAll(async () => {
  console.info(`[fuzz] seed ${SEED}, ${RUNS} runs per route (FUZZ_SEED / FUZZ_RUNS to change)`)
  db = testDb()
  adminCookie = await signIn(DEMO.admin)
  attemptsBefore = Number((await db('sign_in_attempts').max({ id: 'id' }))[0]?.id ?? 0)
  const study = await api<{ id: number }>('/api/studies', { method: 'POST', cookie: adminCookie, body: { title: 'Fuzz study', spec: SPEC } })
  f.studyId = study.body.id
  const rev = await api(`/api/studies/${f.studyId}/revisions`, { method: 'POST', cookie: adminCookie, body: { baseVersion: 0, spec: SPEC, process: { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }, options: { topologies: ['string'], trials: 0, seed: 1 } } })
  expect(rev.status).toBe(201)
  f.presetId = (await api<{ id: number }>('/api/presets', { method: 'POST', cookie: adminCookie, body: { name: 'Fuzz preset', process: { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' } } })).body.id
  f.templateId = (await api<{ id: number }>('/api/templates', { method: 'POST', cookie: adminCookie, body: { name: 'Fuzz template', spec: SPEC } })).body.id
  const pack = matrixPack('fuzz-fixture')
  f.packRowId = (await api<{ id: number }>('/api/rule-packs', { method: 'POST', cookie: adminCookie, body: { pack } })).body.id
  f.packId = pack.id
  const admin = await db('users').where({ email: DEMO.admin }).first('id', 'team_id')
  f.jobId = (await db('evaluations').insert({ team_id: admin.team_id, user_id: admin.id, status: 'done', tasks_total: 1, tasks_done: 1, input: JSON.stringify({}), engine_version: 'fuzz' }))[0]!
  f.invitationToken = randomBytes(32).toString('base64url')
  await db('invitations').insert({ team_id: admin.team_id, email: `fuzz-accept-${Date.now()}@invite.example`, display_name: 'Fuzz Accept', role: 'engineer', token_hash: createHash('sha256').update(f.invitationToken).digest('hex'), expires_at: new Date(Date.now() + 3_600_000), invited_by: admin.id })
  f.db = db
})

afterAll(async () => {
  // The login row's refused attempts count against 127.0.0.1; later spec files sign in from there too.
  await db('sign_in_attempts').where('id', '>', attemptsBefore).delete()
  await db.destroy()
})

async function checksums(tables: string[]): Promise<string> {
  if (tables.length === 0) return ''
  const [rows] = await db.raw(`CHECKSUM TABLE ${tables.map(t => `\`${t}\``).join(', ')}`)
  return JSON.stringify(rows)
}

interface Attempt { path: string, query: string, body?: string }

/** What one run sends: the valid sample with its body, query or one path parameter mutated. */
function attempts(row: FuzzRow, sample: FuzzSample): fc.Arbitrary<Attempt> {
  const [method, template] = row.route.split(' ') as [string, string]
  const fill = (params: Record<string, string>) => template.replace(/:(\w+)/g, (_m, name: string) => encodeParam(params[name] ?? ''))
  const base = { path: fill(sample.params ?? {}), query: new URLSearchParams(sample.query ?? {}).toString() }
  const hasBody = method !== 'GET' && method !== 'DELETE'
  const validBody = hasBody ? JSON.stringify(sample.body ?? {}) : undefined
  const options: fc.Arbitrary<Attempt>[] = [queryMutationOf(sample.query ?? {}).map(query => ({ ...base, query, body: validBody }))]
  if (hasBody) options.push(mutationOf(sample.body ?? {}).map(m => ({ ...base, body: applyMutation(sample.body ?? {}, m) })))
  for (const name of Object.keys(sample.params ?? {})) {
    options.push(nastyParam.map(v => ({ ...base, path: fill({ ...sample.params, [name]: v }), body: validBody })))
  }
  return fc.oneof(...options)
}

async function send(method: string, attempt: Attempt, cookie?: string) {
  const started = Date.now()
  const res = await Promise.race([
    api<{ message?: string, data?: { issues?: { path: string }[] } }>(`${attempt.path}${attempt.query ? `?${attempt.query}` : ''}`, { method, body: attempt.body, cookie }),
    new Promise<never>((_r, reject) => setTimeout(() => reject(new Error(`no answer within ${REQUEST_BOUND_MS} ms`)), REQUEST_BOUND_MS))
  ])
  return { ...res, ms: Date.now() - started }
}

describe(`fuzzing every API route (seed ${SEED})`, () => {
  it('has exactly one fuzz row per API route on disk', () => {
    const inTable = FUZZ_TABLE.map(r => r.route).sort()
    const missing = routesOnDisk().filter(r => !inTable.includes(r))
    expect(missing, `add these routes to tests/api/fuzz-table.ts: ${missing.join(', ')}`).toEqual([])
    expect(inTable.filter(r => !routesOnDisk().includes(r)), 'rows for routes that no longer exist').toEqual([])
    expect(new Set(inTable).size).toBe(inTable.length)
  })

  for (const row of FUZZ_TABLE) {
    it(`${row.route}: 2xx or 4xx, a named field on 400, nothing written when refused`, async () => {
      const [method] = row.route.split(' ') as [string]
      const cookie = row.as === 'admin' ? adminCookie : undefined
      const sample = await row.sample(f)
      await fc.assert(fc.asyncProperty(attempts(row, sample), async (attempt) => {
        const before = await checksums(row.tables)
        const res = await send(method, attempt, cookie)
        const what = `${method} ${attempt.path}?${attempt.query.slice(0, 200)} body ${(attempt.body ?? '').slice(0, 300)} → ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`
        expect(res.status, what).toBeGreaterThanOrEqual(200)
        expect(res.status, what).toBeLessThan(500)
        if (res.status === 400) {
          const issues = res.body.data?.issues ?? []
          expect(issues.length, `400 without field issues: ${what}`).toBeGreaterThan(0)
          expect(res.body.message?.startsWith(`${issues[0]!.path}: `), `400 message does not name the field: ${what}`).toBe(true)
        }
        if (res.status >= 400) expect(await checksums(row.tables), `refused request changed ${row.tables.join(', ')}: ${what}`).toBe(before)
      }), { seed: SEED, numRuns: Math.max(4, Math.round(RUNS * (row.weight ?? 1))), endOnFailure: true })
    }, 180_000)
  }
})
