import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'

let db: Knex
beforeAll(() => {
  db = testDb()
})
afterEach(async () => {
  await db('sign_in_attempts').delete()
})
afterAll(async () => {
  await db.destroy()
})

describe('sign-in', () => {
  it('signs in a demo user and reports the role and team in the session', async () => {
    const cookie = await signIn(DEMO.architect)
    const session = await api<{ role: string, teamName: string, email: string }>('/api/auth/session', { cookie })
    expect(session.status).toBe(200)
    expect(session.body).toMatchObject({ email: DEMO.architect, role: 'architect', teamName: 'Harrow Lake Instruments' })
  })

  it('sets the session cookie httpOnly and SameSite, and returns only an opaque display token', async () => {
    const res = await api<{ token: string }>('/api/auth/login', { method: 'POST', body: { email: DEMO.engineer, password: 'harrow-lake-demo' } })
    const cookie = res.headers.getSetCookie().find(c => c.startsWith('rw_session='))!
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    expect(res.body.token).toMatch(/^[0-9a-f]{32}$/)
    // The display token grants nothing on its own.
    const asBearer = await api('/api/studies', { headers: { authorization: `Bearer ${res.body.token}` } })
    expect(asBearer.status).toBe(401)
  })

  it.each([
    ['an unknown user', { email: 'nobody@harrowlake.example', password: 'harrow-lake-demo' }],
    ['a wrong password', { email: DEMO.admin, password: 'wrong-password' }],
    ['empty fields', { email: '', password: '' }],
    ['no body at all', undefined]
  ])('answers %s with 401 and the same generic message', async (_label, body) => {
    const res = await api<{ statusMessage: string }>('/api/auth/login', { method: 'POST', body })
    expect(res.status).toBe(401)
    expect(res.body.statusMessage).toBe('Email or password is incorrect')
  })

  it('stores passwords as bcrypt hashes, never in clear', async () => {
    const row = await db('users').where({ email: DEMO.admin }).first('password_hash')
    expect(row.password_hash).toMatch(/^\$2[aby]\$1[0-9]\$/)
    expect(await bcrypt.compare('harrow-lake-demo', row.password_hash)).toBe(true)
  })

  it('rate-limits failed sign-ins per account: the sixth try within the window gets 429 even with the right password', async () => {
    for (let i = 0; i < 5; i++) {
      expect((await api('/api/auth/login', { method: 'POST', body: { email: DEMO.manager, password: `nope-${i}` } })).status).toBe(401)
    }
    const blocked = await api('/api/auth/login', { method: 'POST', body: { email: DEMO.manager, password: 'harrow-lake-demo' } })
    expect(blocked.status).toBe(429)
    // Another account from the same address is not blocked by the per-account limit.
    expect((await api('/api/auth/login', { method: 'POST', body: { email: DEMO.engineer, password: 'harrow-lake-demo' } })).status).toBe(200)
  })

  it('rate-limits failed sign-ins per address across accounts', async () => {
    for (let i = 0; i < 20; i++) {
      await api('/api/auth/login', { method: 'POST', body: { email: `guess-${i}@harrowlake.example`, password: 'x' } })
    }
    const blocked = await api('/api/auth/login', { method: 'POST', body: { email: DEMO.admin, password: 'harrow-lake-demo' } })
    expect(blocked.status).toBe(429)
  })

  it('refuses a deactivated user', async () => {
    const team = await db('teams').where({ slug: 'harrow-lake' }).first('id')
    const hash = await bcrypt.hash('inactive-pass-1', 4)
    await db('users').insert({ team_id: team.id, email: 'left@harrowlake.example', display_name: 'Former Colleague', password_hash: hash, role: 'engineer', active: false })
    const res = await api('/api/auth/login', { method: 'POST', body: { email: 'left@harrowlake.example', password: 'inactive-pass-1' } })
    expect(res.status).toBe(401)
  })
})

describe('sign-out', () => {
  it('revokes the session on the server, so the old cookie no longer works', async () => {
    const cookie = await signIn(DEMO.engineer)
    expect((await api('/api/studies', { cookie })).status).toBe(200)
    const out = await api('/api/auth/logout', { method: 'POST', cookie })
    expect(out.status).toBe(200)
    expect((await api('/api/studies', { cookie })).status).toBe(401)
    expect((await api('/api/auth/session', { cookie })).status).toBe(401)
  })

  it('writes an audit entry for each sign-in', async () => {
    const before = await db('audit_log').where({ action: 'sign_in' }).count({ n: '*' })
    await signIn(DEMO.admin)
    const after = await db('audit_log').where({ action: 'sign_in' }).count({ n: '*' })
    expect(Number(after[0]!.n)).toBe(Number(before[0]!.n) + 1)
  })
})
