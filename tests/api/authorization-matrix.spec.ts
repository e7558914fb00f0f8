import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'
import { createTeam } from '../support/teams'
import { AUTHORIZATION_MATRIX, expectedFor, OTHER_ROLES, type Fixtures, type MatrixRow, type OtherRole, type Who } from './authorization-table'
import { TOKEN_CALLERS, tokenExpectation } from './authorization-tokens'

/**
 * Every API route against every kind of caller, from the one table in authorization-table.ts.
 * A route file without a row fails here, so no route ships without its authorization decided.
 */
function routesOnDisk(): string[] {
  const root = join(process.cwd(), 'server/api')
  const out: string[] = []
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const full = join(dir, name)
      if (statSync(full).isDirectory()) walk(full)
      else if (/\.(get|post|patch|put|delete)\.ts$/.test(name)) {
        const [, path, method] = /^(.*)\.(get|post|patch|put|delete)\.ts$/.exec(relative(root, full))!
        const url = `/api/${path!.replace(/(^|\/)index$/, '').replace(/\[(\w+)\]/g, ':$1')}`.replace(/\/$/, '')
        out.push(`${method!.toUpperCase()} ${url}`)
      }
    }
  }
  walk(root)
  return out.sort()
}

let db: Knex
const cookies: Partial<Record<Who, string>> = {}
const fixtures = {} as Fixtures
/** API tokens per token caller, and the display token the sign-in module keeps (as a bearer value it grants nothing). */
const tokens: Record<string, string> = {}
let displayToken = ''

beforeAll(async () => {
  db = testDb()
  for (const role of ['admin', 'architect', 'engineer', 'manager'] as const) cookies[role] = await signIn(DEMO[role])
  // the second team: every role, so each row is tried by another team's admin, architect, engineer and manager
  const other = await createTeam(db, 'matrix')
  const teamId = other.id
  const userId = other.users.admin.id
  cookies.otherTeam = await signIn(other.users.admin.email, other.password)
  for (const [who, role] of Object.entries(OTHER_ROLES) as [OtherRole, 'architect' | 'engineer' | 'manager'][]) cookies[who] = await signIn(other.users[role].email, other.password)
  const demoTeam = await db('teams').where({ slug: 'harrow-lake' }).first('id')
  const own = await db('studies').where({ team_id: demoTeam.id }).first('id')
  const ids = await db('studies').insert({ team_id: teamId, owner_id: userId, title: 'Matrix other-team study', spec: JSON.stringify({ bits: 8 }) })
  fixtures.ownStudyId = own.id
  fixtures.otherTeamStudyId = ids[0]!
  fixtures.otherTeamId = teamId!
  fixtures.otherUserId = userId!
  fixtures.db = db
  for (const caller of TOKEN_CALLERS) {
    const created = await api<{ token: string }>('/api/tokens', { method: 'POST', cookie: cookies[caller.as], body: { name: caller.name, scopes: caller.scopes, expiresInDays: 1 } })
    expect(created.status).toBe(201)
    tokens[caller.name] = created.body.token
  }
  displayToken = (await api<{ token: string }>('/api/auth/login', { method: 'POST', body: { email: DEMO.engineer, password: 'harrow-lake-demo' } })).body.token
})
afterAll(async () => {
  await db.destroy()
})

describe('authorization matrix', () => {
  it('has exactly one row per API route on disk', () => {
    const inTable = AUTHORIZATION_MATRIX.map(r => r.route).sort()
    const missing = routesOnDisk().filter(r => !inTable.includes(r))
    expect(missing, `add these routes to tests/api/authorization-table.ts: ${missing.join(', ')}`).toEqual([])
    expect(inTable.filter(r => !routesOnDisk().includes(r)), 'rows for routes that no longer exist').toEqual([])
    expect(new Set(inTable).size).toBe(inTable.length)
  })

  /** The row's own expectations plus the second team's architect, engineer and manager. */
  const expectations = (row: MatrixRow): [Who, number][] => {
    const listed = Object.entries(row.expect) as [Who, number][]
    const others = (Object.keys(OTHER_ROLES) as OtherRole[]).filter(w => row.expect[w] === undefined)
      .map(w => [w, expectedFor(row, w)] as [Who, number | undefined]).filter((e): e is [Who, number] => e[1] !== undefined)
    return [...listed, ...others]
  }

  it('tries every signed-in row with every role of a second team', () => {
    const signedIn = AUTHORIZATION_MATRIX.filter(r => r.expect.admin !== undefined)
    const missing = signedIn.filter(r => expectations(r).filter(([w]) => w.startsWith('other')).length !== 4).map(r => r.route)
    expect(missing, 'rows without all four roles of the second team').toEqual([])
  })

  for (const row of AUTHORIZATION_MATRIX) {
    for (const [who, expected] of expectations(row)) {
      it(`${row.route} as ${who} → ${expected}`, async () => {
        const [method, pattern] = row.route.split(' ') as [string, string]
        const request = await row.request(fixtures, who)
        const path = request.path ?? pattern
        const res = await api(path, { method, body: request.body, cookie: who === 'signedOut' ? undefined : cookies[who] })
        expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(expected)
      })
    }
  }
})

describe('authorization matrix with API tokens (Authorization: Bearer, no cookie)', () => {
  for (const row of AUTHORIZATION_MATRIX) {
    const [method, pattern] = row.route.split(' ') as [string, string]
    for (const caller of TOKEN_CALLERS) {
      const expected = tokenExpectation(row, caller)
      if (expected === undefined) continue
      it(`${row.route} with ${caller.name} → ${expected}`, async () => {
        const request = await row.request(fixtures, caller.name as Who)
        const res = await api(request.path ?? pattern, { method, body: request.body, headers: { authorization: `Bearer ${tokens[caller.name]}` } })
        expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(expected)
      })
    }
    const display = tokenExpectation(row, 'display')
    if (display !== undefined) {
      it(`${row.route} with the display token as a bearer value → ${display} (as signed out)`, async () => {
        const request = await row.request(fixtures, 'signedOut')
        const res = await api(request.path ?? pattern, { method, body: request.body, headers: { authorization: `Bearer ${displayToken}` } })
        expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(display)
      })
    }
  }
})
