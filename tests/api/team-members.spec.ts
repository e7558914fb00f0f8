import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'

/**
 * An admin changes members' roles and access (PATCH /api/team/members/:id). What is checked is
 * the product's own rule set (common practice, no source): the change and its audit row land
 * together, a role change applies at the member's next request, deactivation ends their
 * sessions, an admin cannot demote or lock out themselves, other teams' members are 404.
 */
let db: Knex
let admin: string
let adminId: number
let teamId: number

beforeAll(async () => {
  db = testDb()
  admin = await signIn(DEMO.admin)
  const row = await db('users').where({ email: DEMO.admin }).first('id', 'team_id')
  adminId = row.id
  teamId = row.team_id
})
afterAll(async () => {
  await db.destroy()
})

async function member(role = 'engineer'): Promise<{ id: number, email: string }> {
  const email = `member-${Date.now()}-${Math.floor(Math.random() * 1e6)}@harrowlake.example`
  const [id] = await db('users').insert({ team_id: teamId, email, display_name: 'Member Under Test', password_hash: await bcrypt.hash('member-test-password', 4), role })
  return { id: id!, email }
}

describe('team members', () => {
  it('changes a role with an audit row; the member has the new role at their next request', async () => {
    const m = await member('engineer')
    const cookie = await signIn(m.email, 'member-test-password')
    const write = () => api('/api/studies', { method: 'POST', cookie, body: { title: 42 } })
    expect((await write()).status).toBe(400) // an engineer may create studies: the body is what is refused
    const res = await api<{ role: string, active: boolean }>(`/api/team/members/${m.id}`, { method: 'PATCH', cookie: admin, body: { role: 'manager' } })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ role: 'manager', active: true })
    const audit = await db('audit_log').where({ action: 'role_changed', target_id: String(m.id) }).first('actor_id', 'detail')
    expect(audit.actor_id).toBe(adminId)
    expect(typeof audit.detail === 'string' ? JSON.parse(audit.detail) : audit.detail).toMatchObject({ from: 'engineer', to: 'manager' })
    expect((await api<{ role: string }>('/api/auth/session', { cookie })).body.role).toBe('manager')
    // program managers read; they do not create studies
    expect((await write()).status).toBe(403)
  })

  it('deactivation ends the member\'s sessions and sign-in, reactivation restores sign-in; both audited', async () => {
    const m = await member()
    const cookie = await signIn(m.email, 'member-test-password')
    expect((await api(`/api/team/members/${m.id}`, { method: 'PATCH', cookie: admin, body: { active: false } })).status).toBe(200)
    expect((await api('/api/studies', { cookie })).status).toBe(401)
    expect((await api('/api/auth/login', { method: 'POST', body: { email: m.email, password: 'member-test-password' } })).status).toBe(401)
    expect((await api(`/api/team/members/${m.id}`, { method: 'PATCH', cookie: admin, body: { active: true } })).status).toBe(200)
    expect(await signIn(m.email, 'member-test-password')).toBeTruthy()
    const actions = (await db('audit_log').where({ target_type: 'user', target_id: String(m.id) }).orderBy('id').pluck('action')) as string[]
    expect(actions.filter(a => a.startsWith('member_'))).toEqual(['member_deactivated', 'member_reactivated'])
    expect(actions.filter(a => a === 'sign_in')).toHaveLength(2)
  })

  it('refuses an admin\'s change to their own role or access (409, nothing written)', async () => {
    const before = await db('audit_log').count({ n: '*' }).first()
    const own = await api<{ message: string }>(`/api/team/members/${adminId}`, { method: 'PATCH', cookie: admin, body: { role: 'engineer' } })
    expect(own.status).toBe(409)
    expect(own.body.message).toMatch(/^role: you cannot change your own role/)
    expect((await api(`/api/team/members/${adminId}`, { method: 'PATCH', cookie: admin, body: { active: false } })).status).toBe(409)
    expect((await db('users').where({ id: adminId }).first('role', 'active'))).toMatchObject({ role: 'admin' })
    expect(await db('audit_log').count({ n: '*' }).first()).toEqual(before)
    // the same values are no change, so no refusal
    expect((await api(`/api/team/members/${adminId}`, { method: 'PATCH', cookie: admin, body: { role: 'admin', active: true } })).status).toBe(200)
  })

  it('names the field of a bad body, and answers 404 for a member of another team and 403 for non-admins', async () => {
    const m = await member()
    const bad = await api<{ message: string }>(`/api/team/members/${m.id}`, { method: 'PATCH', cookie: admin, body: { role: 'owner' } })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/^role: must be one of admin, architect, engineer, manager/)
    expect((await api<{ message: string }>(`/api/team/members/${m.id}`, { method: 'PATCH', cookie: admin, body: {} })).body.message).toMatch(/^role: give a new role, active, or both/)
    expect((await api(`/api/team/members/${m.id}`, { method: 'PATCH', cookie: admin, body: { active: 'no' } })).status).toBe(400)
    const [otherTeam] = await db('teams').insert({ name: 'Members Elsewhere', slug: `members-${Date.now()}` })
    const [stranger] = await db('users').insert({ team_id: otherTeam, email: `stranger-${Date.now()}@elsewhere.example`, display_name: 'Stranger', password_hash: 'x', role: 'engineer' })
    expect((await api(`/api/team/members/${stranger}`, { method: 'PATCH', cookie: admin, body: { role: 'admin' } })).status).toBe(404)
    expect((await db('users').where({ id: stranger }).first('role')).role).toBe('engineer')
    const architect = await signIn(DEMO.architect)
    expect((await api(`/api/team/members/${m.id}`, { method: 'PATCH', cookie: architect, body: { role: 'admin' } })).status).toBe(403)
  })
})
