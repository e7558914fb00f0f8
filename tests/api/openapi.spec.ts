import { randomBytes } from 'node:crypto'
import { compileErrors, validate } from '@readme/openapi-parser'
import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import type { OpenAPIV3_1 } from 'openapi-types'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { testDb } from '../support/db'
import { api, signIn } from '../support/http'
import { routesOnDisk } from '../support/routes'

/**
 * The OpenAPI description at /api/openapi.json: valid OpenAPI 3.1 by a well-known validator
 * (@readme/openapi-parser, which checks the document against the published OpenAPI 3.1 schema),
 * one operation for every route file and no other, and every request example accepted by the live
 * route's validation (never a 400; the engine and create examples answer 2xx).
 */
let db: Knex
let doc: OpenAPIV3_1.Document
const auth = { adminCookie: '', admin: '', architect: '' }
const ids: Record<string, number> = {}

/** Examples that must be accepted outright on fresh fixtures (the others may meet a 404/409/423 of state, never a 400). */
const ACCEPTED = ['POST /api/solve', 'POST /api/evaluate', 'POST /api/netlist', 'POST /api/evaluations', 'POST /api/studies', 'POST /api/studies/import/preview', 'POST /api/studies/import', 'POST /api/studies/{id}/notes', 'POST /api/presets', 'POST /api/templates', 'POST /api/tokens', 'POST /api/rule-packs/dry-run', 'PATCH /api/team/members/{id}', 'POST /api/team/invitations']

async function tokenOf(cookie: string): Promise<string> {
  const res = await api<{ token: string }>('/api/tokens', { method: 'POST', cookie, body: { name: 'OpenAPI spec', scopes: ['read', 'write', 'evaluate'], expiresInDays: 1 } })
  expect(res.status).toBe(201)
  return res.body.token
}

beforeAll(async () => {
  db = testDb()
  doc = (await api<OpenAPIV3_1.Document>('/api/openapi.json')).body
  const stamp = `${Date.now()}-${randomBytes(3).toString('hex')}`
  const [teamId] = await db('teams').insert({ name: 'OpenAPI Team', slug: `openapi-${stamp}` })
  const hash = await bcrypt.hash('openapi-team-password', 4)
  for (const role of ['admin', 'architect'] as const) {
    ids[role] = (await db('users').insert({ team_id: teamId, email: `openapi-${role}-${stamp}@openapi.example`, display_name: `OpenAPI ${role}`, password_hash: hash, role }))[0]!
  }
  auth.adminCookie = await signIn(`openapi-admin-${stamp}@openapi.example`, 'openapi-team-password')
  auth.admin = await tokenOf(auth.adminCookie)
  auth.architect = await tokenOf(await signIn(`openapi-architect-${stamp}@openapi.example`, 'openapi-team-password'))
  const bearer = { authorization: `Bearer ${auth.admin}` }
  const study = await api<{ id: number }>('/api/studies', { method: 'POST', headers: bearer, body: { title: 'OpenAPI study', spec: { bits: 4, vrefV: 1, updateRateHz: 1e6, loadCapacitanceF: 1e-12, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 } } })
  ids.studies = study.body.id
  ids.notes = (await api<{ id: number }>(`/api/studies/${ids.studies}/notes`, { method: 'POST', headers: bearer, body: { body: 'fixture' } })).body.id
  ids.presets = (await api<{ id: number }>('/api/presets', { method: 'POST', headers: bearer, body: { name: `Fixture ${stamp}`, process: { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' } } })).body.id
  ids.templates = (await api<{ id: number }>('/api/templates', { method: 'POST', headers: bearer, body: { name: `Fixture ${stamp}`, spec: { bits: 8, vrefV: 1, updateRateHz: 1e6, loadCapacitanceF: 1e-12, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 } } })).body.id
  ids.members = (await db('users').insert({ team_id: teamId, email: `openapi-member-${stamp}@openapi.example`, display_name: 'Member', password_hash: hash, role: 'engineer' }))[0]!
})
afterAll(async () => {
  await db.destroy()
})

/** A path with its parameters filled from the fixtures (the first path word names the kind of record). */
function fill(path: string): string {
  const kind = path.split('/')[2]!
  return path.replace(/\{(\w+)\}/g, (_m, name: string) => {
    if (name === 'token') return randomBytes(24).toString('base64url')
    if (name === 'n') return '1'
    if (kind === 'team') return String(ids.members)
    return String(ids[kind] ?? 2147483000)
  })
}

describe('OpenAPI description', () => {
  it('is a valid OpenAPI 3.1 document (@readme/openapi-parser)', async () => {
    expect(doc.openapi).toBe('3.1.0')
    const result = await validate(structuredClone(doc) as never)
    expect(result.valid, result.valid ? '' : compileErrors(result)).toBe(true)
  })

  it('has exactly one operation per route file', () => {
    const inDoc = Object.entries(doc.paths ?? {}).flatMap(([path, item]) => Object.keys(item ?? {}).map(m => `${m.toUpperCase()} ${path.replace(/\{(\w+)\}/g, ':$1')}`)).sort()
    expect(inDoc).toEqual(routesOnDisk())
  })

  it('has request examples that the live routes accept', async () => {
    let sent = 0
    for (const [path, item] of Object.entries(doc.paths ?? {})) {
      for (const [method, op] of Object.entries(item ?? {}) as [string, OpenAPIV3_1.OperationObject][]) {
        const body = op.requestBody && 'content' in op.requestBody ? op.requestBody.content['application/json'] : undefined
        if (!body) continue
        const route = `${method.toUpperCase()} ${path}`
        expect(body.example, `${route} has no request example`).toBeDefined()
        const sessionOnly = (op.security ?? []).length === 1
        const headers = sessionOnly ? undefined : { authorization: `Bearer ${route.endsWith('/reviews') ? auth.architect : auth.admin}` }
        // an example that names a reviewer names one of the caller's team
        const example = route.endsWith('/review-request') ? { ...body.example as object, reviewerIds: [ids.architect] } : body.example
        const res = await api<{ message?: string }>(fill(path), { method: method.toUpperCase(), body: example, headers, cookie: sessionOnly ? auth.adminCookie : undefined })
        const what = `${route}: ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`
        expect(res.status, what).not.toBe(400)
        expect(res.status, what).toBeLessThan(500)
        if (ACCEPTED.includes(route)) expect(res.status, what).toBeLessThan(300)
        sent += 1
      }
    }
    expect(sent).toBe(31)
  }, 120_000)
})
