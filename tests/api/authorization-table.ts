import type { Knex } from 'knex'
import { IO_ROWS } from './authorization-io'
import { LIBRARY_ROWS } from './authorization-library'
import { NOTE_ROWS } from './authorization-notes'
import { REVIEW_ROWS } from './authorization-review'
import { RULE_PACK_ROWS } from './authorization-rule-packs'
import { TOKEN_ROWS } from './authorization-token-routes'

/**
 * Kinds of caller: no session, each role of the demo team, and each role of a second team
 * ('otherTeam' is its admin). A row names what it must (signedOut, the demo roles, otherTeam); the
 * second team's architect, engineer and manager get `expectedFor` unless the row names them too.
 */
export type Who = 'signedOut' | 'admin' | 'architect' | 'engineer' | 'manager' | 'otherTeam' | OtherRole
export type OtherRole = 'otherArchitect' | 'otherEngineer' | 'otherManager'
export const OTHER_ROLES: Record<OtherRole, 'architect' | 'engineer' | 'manager'> = { otherArchitect: 'architect', otherEngineer: 'engineer', otherManager: 'manager' }

/**
 * Another team's member: refused by role (403) where the same role of the demo team is, since the
 * role check comes first; otherwise whatever the other team's admin gets (404 for the demo team's
 * records, or their own team's answer).
 */
export function expectedFor(row: MatrixRow, who: OtherRole): number | undefined {
  if (row.expect[who] !== undefined) return row.expect[who]
  const own = row.expect[OTHER_ROLES[who]]
  if (own === undefined || row.expect.otherTeam === undefined) return undefined
  return own === 403 ? 403 : row.expect.otherTeam
}

export interface Fixtures {
  db: Knex
  ownStudyId: number
  otherTeamStudyId: number
  otherTeamId: number
  otherUserId: number
}

export interface MatrixRow {
  route: string
  /** expected status per caller */
  expect: Partial<Record<Who, number>>
  /** the concrete request (path with ids filled in, a valid body) for that caller */
  request: (f: Fixtures, who: Who) => Promise<{ path?: string, body?: unknown }> | { path?: string, body?: unknown }
}

const SPEC8 = { bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }
const LADDER = { topology: 'r2r-voltage', bits: 3, vrefV: 1, legsOhm: [2e4, 2e4, 2e4], seriesOhm: [1e4, 1e4], terminationOhm: 2e4 }
const EVALUATE = {
  spec: SPEC8,
  process: { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' },
  options: { topologies: ['r2r-voltage'], trials: 50, seed: 1 }
}

const ALL_SIGNED_IN = { admin: 200, architect: 200, engineer: 200, manager: 200, otherTeam: 200 }

/** An evaluation job row of the demo team's engineer, finished, to read or cancel. */
async function ownJob(f: Fixtures): Promise<number> {
  const engineer = await f.db('users').where({ email: 'engineer@harrowlake.example' }).first('id', 'team_id')
  const [id] = await f.db('evaluations').insert({ team_id: engineer.team_id, user_id: engineer.id, status: 'done', tasks_total: 1, tasks_done: 1, input: JSON.stringify(EVALUATE), engine_version: 'matrix' })
  return id!
}

export const AUTHORIZATION_MATRIX: MatrixRow[] = [
  { route: 'GET /api/health', expect: { signedOut: 200 }, request: () => ({}) },
  { route: 'POST /api/auth/login', expect: { signedOut: 401 }, request: () => ({ body: { email: 'nobody@matrix.example', password: 'x' } }) },
  { route: 'POST /api/auth/logout', expect: { signedOut: 200 }, request: () => ({}) },
  { route: 'GET /api/auth/session', expect: { signedOut: 401, ...ALL_SIGNED_IN }, request: () => ({}) },
  { route: 'GET /api/studies', expect: { signedOut: 401, ...ALL_SIGNED_IN }, request: () => ({}) },
  {
    route: 'POST /api/studies',
    expect: { signedOut: 401, admin: 201, architect: 201, engineer: 201, manager: 403, otherTeam: 201 },
    request: () => ({ body: { title: 'Matrix study', spec: SPEC8 } })
  },
  {
    route: 'GET /api/studies/:id',
    expect: { signedOut: 401, admin: 200, architect: 200, engineer: 200, manager: 200, otherTeam: 404 },
    request: f => ({ path: `/api/studies/${f.ownStudyId}` })
  },
  { route: 'POST /api/solve', expect: { signedOut: 401, ...ALL_SIGNED_IN }, request: () => ({ body: LADDER }) },
  { route: 'POST /api/netlist', expect: { signedOut: 401, ...ALL_SIGNED_IN }, request: () => ({ body: { circuit: LADDER } }) },
  { route: 'POST /api/evaluate', expect: { signedOut: 401, ...ALL_SIGNED_IN }, request: () => ({ body: EVALUATE }) },
  {
    route: 'POST /api/evaluations',
    expect: { signedOut: 401, admin: 202, architect: 202, engineer: 202, manager: 202, otherTeam: 202 },
    request: () => ({ body: EVALUATE })
  },
  {
    route: 'GET /api/evaluations/:id',
    expect: { signedOut: 401, admin: 200, architect: 200, engineer: 200, manager: 200, otherTeam: 404 },
    request: async f => ({ path: `/api/evaluations/${await ownJob(f)}` })
  },
  {
    route: 'DELETE /api/evaluations/:id',
    expect: { signedOut: 401, admin: 200, architect: 403, engineer: 200, manager: 403, otherTeam: 404, otherArchitect: 404, otherManager: 404 },
    request: async f => ({ path: `/api/evaluations/${await ownJob(f)}` })
  },
  ...RULE_PACK_ROWS,
  ...LIBRARY_ROWS,
  ...NOTE_ROWS,
  ...IO_ROWS,
  ...REVIEW_ROWS,
  { route: 'GET /api/team', expect: { signedOut: 401, ...ALL_SIGNED_IN }, request: () => ({}) },
  {
    route: 'POST /api/team/invitations',
    expect: { signedOut: 401, admin: 201, architect: 403, engineer: 403, manager: 403, otherTeam: 201 },
    request: (_f, who) => ({ body: { email: `matrix-${who}-${Date.now()}@invite.example`, name: 'Matrix Invitee', role: 'engineer' } })
  },
  {
    // a fresh member of the demo team: its admin changes them, another team's admin cannot see them
    route: 'PATCH /api/team/members/:id',
    expect: { signedOut: 401, admin: 200, architect: 403, engineer: 403, manager: 403, otherTeam: 404 },
    request: async (f, who) => {
      const team = (await f.db('teams').where({ slug: 'harrow-lake' }).first('id')).id
      const [id] = await f.db('users').insert({ team_id: team, email: `matrix-member-${who}-${Date.now()}@members.example`, display_name: 'Matrix Member', password_hash: 'x', role: 'engineer' })
      return { path: `/api/team/members/${id}`, body: { role: 'manager' } }
    }
  },
  { route: 'GET /api/invitations/:token', expect: { signedOut: 404 }, request: () => ({ path: '/api/invitations/unknown-token-0123456789abc' }) },
  {
    route: 'POST /api/invitations/:token/accept',
    expect: { signedOut: 410 },
    request: () => ({ path: '/api/invitations/unknown-token-0123456789abc/accept', body: { password: 'long-enough-password' } })
  },
  { route: 'GET /api/admin/mail', expect: { signedOut: 401, admin: 200, architect: 403, engineer: 403, manager: 403, otherTeam: 200 }, request: () => ({}) },
  { route: 'GET /api/portfolio', expect: { signedOut: 401, ...ALL_SIGNED_IN }, request: () => ({}) },
  { route: 'GET /api/portfolio/export', expect: { signedOut: 401, ...ALL_SIGNED_IN }, request: () => ({}) },
  ...TOKEN_ROWS,
  { route: 'GET /api/openapi.json', expect: { signedOut: 200 }, request: () => ({}) }
]
