import { createHash, randomBytes } from 'node:crypto'
import bcrypt from 'bcryptjs'
import fc from 'fast-check'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { testDb } from '../support/db'
import { applyMutation, encodeParam, mutationOf, nastyParam, queryMutationOf } from '../support/fuzz'
import { api, signIn } from '../support/http'
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
let architectCookie = ''
const cookieOf = (as: FuzzRow['as']) => (as === 'admin' ? adminCookie : as === 'architect' ? architectCookie : undefined)
/** How a row calls: the session cookie, or (adminToken) a token of its own, so no row spends another's rate limit. */
async function authOf(as: FuzzRow['as']): Promise<Auth> {
  return as === 'adminToken' ? { headers: { authorization: `Bearer ${(await f.token()).token}` } } : { cookie: cookieOf(as) }
}
interface Auth { cookie?: string, headers?: Record<string, string> }
let attemptsBefore = 0
const f = {} as FuzzFixtures

beforeAll(async () => {
  console.info(`[fuzz] seed ${SEED}, ${RUNS} runs per route (FUZZ_SEED / FUZZ_RUNS to change)`)
  db = testDb()
  // Everything runs in a team of its own: a mutated path parameter that names a demo record (or
  // another spec file's) is another team's, so it gets 404 and is never changed or deleted.
  const team = await fuzzTeam()
  adminCookie = team.adminCookie
  architectCookie = team.architectCookie
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
  const admin = await db('users').where({ email: team.emails.admin }).first('id', 'team_id')
  f.jobId = (await db('evaluations').insert({ team_id: admin.team_id, user_id: admin.id, status: 'done', tasks_total: 1, tasks_done: 1, input: JSON.stringify({}), engine_version: 'fuzz' }))[0]!
  f.invitationToken = randomBytes(32).toString('base64url')
  await db('invitations').insert({ team_id: admin.team_id, email: `fuzz-accept-${Date.now()}@invite.example`, display_name: 'Fuzz Accept', role: 'engineer', token_hash: createHash('sha256').update(f.invitationToken).digest('hex'), expires_at: new Date(Date.now() + 3_600_000), invited_by: admin.id })
  f.db = db
  await notesAndReviewFixtures(admin, team.emails)
  // written directly (the route's own row fuzzes creation, up to the cap of active tokens)
  f.token = async () => {
    const token = `rwt_${randomBytes(32).toString('base64url')}`
    const [tokenId] = await db('api_tokens').insert({ user_id: admin.id, team_id: admin.team_id, name: 'Fuzz token', prefix: token.slice(0, 12), token_hash: createHash('sha256').update(token).digest('hex'), scopes: 'read,write,evaluate', expires_at: new Date(Date.now() + 86_400_000) })
    return { id: tokenId!, token }
  }
  f.member = async () => (await db('users').insert({ team_id: admin.team_id, email: `fuzz-member-${Date.now()}-${Math.floor(Math.random() * 1e9)}@fuzz.example`, display_name: 'Fuzz Member', password_hash: 'x', role: 'engineer' }))[0]!
})

/** The fuzz team: an admin, an architect and an engineer (signed in: admin and architect). */
async function fuzzTeam() {
  const stamp = `${Date.now()}-${SEED}`
  const [teamId] = await db('teams').insert({ name: 'Fuzz Team', slug: `fuzz-${stamp}` })
  const password = 'fuzz-team-password'
  const hash = await bcrypt.hash(password, 4)
  const emails = { admin: `fuzz-admin-${stamp}@fuzz.example`, architect: `fuzz-architect-${stamp}@fuzz.example`, engineer: `fuzz-engineer-${stamp}@fuzz.example` }
  for (const role of ['admin', 'architect', 'engineer'] as const) {
    await db('users').insert({ team_id: teamId, email: emails[role], display_name: `Fuzz ${role}`, password_hash: hash, role })
  }
  return { emails, adminCookie: await signIn(emails.admin, password), architectCookie: await signIn(emails.architect, password) }
}

/** Arbitrary metric values in the output contract's shape (fixtures for reads and bench uploads, not physics). */
function fixtureResults(candidateId: string) {
  const series = { codes: [0], min: [0], max: [0] }
  return { engineVersion: 'fuzz', candidates: [{ id: candidateId, topology: candidateId, unaryBits: null, metrics: { resistorCount: 9, totalAreaMm2: 0.01 }, meetsSpec: true, failing: [], linearity: { definition: 'endpoint', monteCarlo: null }, glitch: { perTransition: series }, reference: { irefA: series, rinOhm: series }, output: { routOhm: series } }], cautions: [] }
}

async function notesAndReviewFixtures(admin: { id: number, team_id: number }, emails: { architect: string, engineer: string }) {
  const engineer = await db('users').where({ email: emails.engineer }).first('id')
  f.architectId = (await db('users').where({ email: emails.architect }).first('id')).id
  f.note = async (resolved = false) => {
    const res = await api<{ id: number }>(`/api/studies/${f.studyId}/notes`, { method: 'POST', cookie: adminCookie, body: { body: 'Fuzz note' } })
    expect(res.status).toBe(201)
    if (resolved) expect((await api(`/api/notes/${res.body.id}/resolve`, { method: 'POST', cookie: adminCookie, body: {} })).status).toBe(200)
    return res.body.id
  }
  f.attachment = async () => {
    const data = Buffer.from('code,volts\n0,0\n')
    return (await db('note_attachments').insert({ team_id: admin.team_id, note_id: await f.note(), filename: 'fuzz.csv', mime_type: 'text/csv', size_bytes: data.length, sha256: createHash('sha256').update(data).digest('hex'), data, uploaded_by: admin.id }))[0]!
  }
  const bits4 = { ...SPEC, bits: 4, vrefV: 1 }
  f.study = async (status = 'draft') => {
    const [id] = await db('studies').insert({ team_id: admin.team_id, owner_id: engineer.id, title: `Fuzz ${status} ${Date.now()}`, spec: JSON.stringify(bits4), status: status === 'signed_off' ? 'in_review' : status, version: 1 })
    await db('study_revisions').insert({
      study_id: id, number: 1, spec: JSON.stringify(bits4), process: JSON.stringify({ sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }),
      options: JSON.stringify({ topologies: ['r2r-voltage'], trials: 0, seed: 1, inlDefinition: 'endpoint', envelopePoints: 256, confidence: 0.95 }),
      engine_version: 'fuzz', results: JSON.stringify(fixtureResults('r2r-voltage')), author_id: engineer.id
    })
    if (status !== 'in_review' && status !== 'signed_off') return { id: id!, signOffId: null }
    await db('study_reviews').insert({ study_id: id, round: 1, kind: 'assigned', reviewer_id: f.architectId, revision_number: 1, created_by: engineer.id })
    if (status === 'in_review') return { id: id!, signOffId: null }
    const [signOffId] = await db('study_reviews').insert({ study_id: id, round: 1, kind: 'signed_off', reviewer_id: f.architectId, revision_number: 1, created_by: f.architectId })
    return { id: id!, signOffId: signOffId! }
  }
  f.bench = async studyId => (await db('bench_measurements').insert({ team_id: admin.team_id, study_id: studyId, candidate_id: 'r2r-voltage', revision_number: 1, uploaded_by: engineer.id, file_name: 'fuzz.csv', quantity: 'voltage', bits: 4, points: JSON.stringify(Array.from({ length: 16 }, (_, k) => k / 16)), summary: JSON.stringify({}) }))[0]!
}

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

async function send(method: string, attempt: Attempt, auth: Auth) {
  const started = Date.now()
  const res = await Promise.race([
    api<{ message?: string, data?: { issues?: { path: string }[] } }>(`${attempt.path}${attempt.query ? `?${attempt.query}` : ''}`, { method, body: attempt.body, ...auth }),
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
    if (row.accepts !== undefined) {
      it(`${row.route}: its unmutated sample is accepted (${row.accepts})`, async () => {
        const [method, template] = row.route.split(' ') as [string, string]
        const sample = await row.sample(f)
        const path = template.replace(/:(\w+)/g, (_m, name: string) => encodeParam(sample.params?.[name] ?? ''))
        const query = new URLSearchParams(sample.query ?? {}).toString()
        const res = await send(method, { path, query, body: method === 'GET' || method === 'DELETE' ? undefined : JSON.stringify(sample.body ?? {}) }, await authOf(row.as))
        expect(res.status, `${method} ${path}: ${JSON.stringify(res.body).slice(0, 300)}`).toBe(row.accepts)
      })
    }
    it(`${row.route}: 2xx or 4xx, a named field on 400, nothing written when refused`, async () => {
      const [method] = row.route.split(' ') as [string]
      const auth = await authOf(row.as)
      const sample = await row.sample(f)
      await fc.assert(fc.asyncProperty(attempts(row, sample), async (attempt) => {
        const before = await checksums(row.tables)
        const res = await send(method, attempt, auth)
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
