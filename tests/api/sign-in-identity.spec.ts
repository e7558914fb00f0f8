import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest'
import { startAppServer, stopAppServer } from '../support/app-server'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'

/**
 * Issue 13, findings 2 and 7: one canonical form of an e-mail address for sign-in, lockout and
 * uniqueness (Unicode NFKC, UAX #15, then lower case), and a per-address limit that counts distinct
 * accounts, believing X-Forwarded-For only from a configured proxy.
 */
let db: Knex
let started: Date
beforeAll(() => {
  db = testDb()
})
afterEach(async () => {
  await db('sign_in_attempts').where('attempted_at', '>=', started).delete()
})
afterAll(async () => {
  await db('sign_in_attempts').where('attempted_at', '>=', started).delete()
  await db.destroy()
})

const PASSWORD = 'variant-test-password'
const login = (email: string, password: string, headers: Record<string, string> = {}, base?: string) => base
  ? fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', ...headers }, body: JSON.stringify({ email, password }) }).then(r => ({ status: r.status }))
  : api('/api/auth/login', { method: 'POST', body: { email, password }, headers })

async function member(tag: string): Promise<string> {
  started ??= new Date(Date.now() - 2000)
  const team = await db('teams').where({ slug: 'harrow-lake' }).first('id')
  const email = `architect-${tag}-${Date.now()}@variants.example`
  await db('users').insert({ team_id: team.id, email, display_name: `Variant ${tag}`, password_hash: await bcrypt.hash(PASSWORD, 4), role: 'architect' })
  return email
}

/** Spellings of one address: case, full-width letters (NFKC folds them), padding, accents composed (NFC) and decomposed (NFD). */
function variants(email: string) {
  const fullWidth = [...email].map(c => (/[a-z]/.test(c) ? String.fromCharCode(c.charCodeAt(0) + 0xFEE0) : c)).join('')
  return {
    upper: email.toUpperCase(),
    fullWidth,
    padded: `  ${email}\t`,
    accentNfc: email.replace(/^a/, '\u00E1'),
    accentNfd: email.replace(/^a/, 'a\u0301'),
    accentUpper: email.replace(/^a/, '\u00C1').toUpperCase()
  }
}

describe('one canonical address', () => {
  it('keeps the account locked under every spelling, and no spelling clears the lock', async () => {
    const email = await member('lock')
    for (let i = 0; i < 5; i++) expect((await login(email, `wrong-${i}`)).status).toBe(401)
    for (const [name, v] of Object.entries(variants(email))) {
      expect((await login(v, 'still-wrong')).status, `${name} wrong`).toBe(429)
      expect((await login(v, PASSWORD)).status, `${name} right password`).toBe(429)
    }
    expect((await login(email, PASSWORD)).status).toBe(429)
  })

  it('counts failures under any spelling toward the one lock', async () => {
    const email = await member('spread')
    const v = Object.values(variants(email))
    for (let i = 0; i < 5; i++) expect((await login(v[i]!, `wrong-${i}`)).status).toBe(401)
    expect((await login(email, PASSWORD)).status).toBe(429)
  })

  it('signs in under case, width and padding variants, but an accented address is another address', async () => {
    const email = await member('signin')
    const v = variants(email)
    for (const spelling of [v.upper, v.fullWidth, v.padded]) expect((await login(spelling, PASSWORD)).status, spelling).toBe(200)
    // the database compares accent-insensitively; the app must not: á… is not a…
    expect((await login(v.accentNfc, PASSWORD)).status).toBe(401)
    expect((await login(v.accentNfd, PASSWORD)).status).toBe(401)
  })

  it('refuses an invitation to a full-width spelling of a member\'s address as that member', async () => {
    const admin = await signIn(DEMO.admin)
    const fullWidth = variants(DEMO.engineer).fullWidth
    const res = await api<{ message: string }>('/api/team/invitations', { method: 'POST', cookie: admin, body: { email: fullWidth, name: 'Twin', role: 'engineer' } })
    expect(res.status).toBe(409)
    expect(await db('invitations').where({ email: fullWidth }).first('id')).toBeUndefined()
  })
})

describe('per-address limit', () => {
  it('does not lock everyone behind one address when a few people mistype their own passwords', async () => {
    const emails = await Promise.all([0, 1, 2, 3].map(i => member(`proxy${i}`)))
    // 4 accounts × 5 failures = 20 failed attempts from one address (the old limit locked it)
    for (const email of emails) for (let i = 0; i < 5; i++) await login(email, `wrong-${i}`)
    expect((await login(DEMO.manager, 'harrow-lake-demo')).status).toBe(200)
  })

  it('still stops one address trying many accounts, whatever X-Forwarded-For it claims', async () => {
    await member('spray')
    for (let i = 0; i < 20; i++) await login(`spray-${i}-${Date.now()}@variants.example`, 'x', { 'x-forwarded-for': `198.51.100.${i + 1}` })
    expect((await login(DEMO.manager, 'harrow-lake-demo', { 'x-forwarded-for': '198.51.100.250' })).status).toBe(429)
  })

  it('believes X-Forwarded-For from a configured proxy: clients behind it are counted apart', async () => {
    const server = await startAppServer(inject('databaseUrl'), { NUXT_TRUSTED_PROXIES: '127.0.0.1, ::1' })
    try {
      await member('behind')
      for (let i = 0; i < 20; i++) await login(`behind-${i}-${Date.now()}@variants.example`, 'x', { 'x-forwarded-for': '203.0.113.7' }, server.url)
      expect((await login(DEMO.manager, 'harrow-lake-demo', { 'x-forwarded-for': '203.0.113.7' }, server.url)).status).toBe(429)
      // a client the proxy names differently; entries left of the proxy's own are the client's claim
      expect((await login(DEMO.manager, 'harrow-lake-demo', { 'x-forwarded-for': '203.0.113.7, 203.0.113.8' }, server.url)).status).toBe(200)
      const session = await db('sessions').orderBy('id', 'desc').first('ip')
      expect(session.ip).toBe('203.0.113.8')
    } finally {
      await stopAppServer(server)
    }
  })
})
