import { createHash, randomBytes } from 'node:crypto'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { startAppServer, stopAppServer, type AppServer } from '../support/app-server'
import { testDb } from '../support/db'
import { DEMO, DEMO_PASSWORD } from '../support/http'

/**
 * Passwords never leave the request that carries them: not in a response (body or headers), not in
 * the server's stdout/stderr, not in the audit log, while sign-ins (good and bad) and an invitation
 * acceptance are audited. A server of its own, so its output can be read in full.
 */
let server: AppServer
let db: Knex
let firstAttempt = 0
let firstAudit = 0
const seen: string[] = []
const WRONG = `wrong-${DEMO_PASSWORD}`
const NEW_PASSWORD = `fresh-${randomBytes(6).toString('hex')}-passphrase`
const SHORT = 'short-pw'

async function post(path: string, body: unknown) {
  const res = await fetch(`${server.url}${path}`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: typeof body === 'string' ? body : JSON.stringify(body) })
  const text = await res.text()
  seen.push(text, ...[...res.headers.entries()].map(([k, v]) => `${k}: ${v}`))
  return { status: res.status, text }
}

beforeAll(async () => {
  db = testDb()
  firstAttempt = Number((await db('sign_in_attempts').max({ id: 'id' }))[0]?.id ?? 0)
  firstAudit = Number((await db('audit_log').max({ id: 'id' }))[0]?.id ?? 0)
  server = await startAppServer(inject('databaseUrl'))
})
afterAll(async () => {
  await stopAppServer(server)
  await db('sign_in_attempts').where('id', '>', firstAttempt).delete()
  await db.destroy()
})

describe('passwords stay secret; sign-ins are audited', () => {
  it('signs in, refuses wrong passwords, enforces the minimum length on acceptance, and audits each', async () => {
    expect((await post('/api/auth/login', { email: DEMO.engineer, password: DEMO_PASSWORD })).status).toBe(200)
    expect((await post('/api/auth/login', { email: DEMO.engineer, password: WRONG })).status).toBe(401)
    expect((await post('/api/auth/login', { email: 'nobody@passwords.example', password: DEMO_PASSWORD })).status).toBe(401)
    expect((await post('/api/auth/login', `{"email":"${DEMO.engineer}","password":"${DEMO_PASSWORD}"`)).status).toBe(401)

    const admin = await db('users').where({ email: DEMO.admin }).first('id', 'team_id')
    const token = randomBytes(32).toString('base64url')
    const email = `passwords-${Date.now()}@invite.example`
    await db('invitations').insert({ team_id: admin.team_id, email, display_name: 'Password Test', role: 'engineer', token_hash: createHash('sha256').update(token).digest('hex'), expires_at: new Date(Date.now() + 3_600_000), invited_by: admin.id })
    const short = await post(`/api/invitations/${token}/accept`, { password: SHORT })
    expect(short.status).toBe(400)
    expect(JSON.parse(short.text).message).toBe('password: must be 12 to 200 characters')
    expect((await post(`/api/invitations/${token}/accept`, { password: NEW_PASSWORD })).status).toBe(201)
    expect((await post('/api/auth/login', { email, password: NEW_PASSWORD })).status).toBe(200)

    const audit = await db('audit_log').where('id', '>', firstAudit).orderBy('id').select('action', 'detail', 'actor_id', 'target_id')
    const actions = audit.map(a => a.action)
    expect(actions.filter(a => a === 'sign_in')).toHaveLength(2)
    expect(actions.filter(a => a === 'sign_in_failed').length).toBeGreaterThanOrEqual(2)
    expect(actions).toContain('invitation_accepted')
    const failed = audit.filter(a => a.action === 'sign_in_failed').map(a => (typeof a.detail === 'string' ? JSON.parse(a.detail) : a.detail))
    expect(failed.map(d => d.email)).toEqual(expect.arrayContaining([DEMO.engineer, 'nobody@passwords.example']))

    const everything = [...seen, server.log(), JSON.stringify(audit)].join('\n')
    for (const secret of [DEMO_PASSWORD, WRONG, NEW_PASSWORD, SHORT]) expect(everything.includes(secret), `"${secret}" leaked`).toBe(false)
    const hashes = await db('users').where({ email }).first('password_hash')
    expect(hashes.password_hash).toMatch(/^\$2[aby]\$12\$/) // bcrypt, cost 12
  })
})
