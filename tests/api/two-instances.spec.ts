import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { startAppServer, stopAppServer, type AppServer } from '../support/app-server'
import { testDb } from '../support/db'
import { DEMO, DEMO_PASSWORD } from '../support/http'
import { caughtMail } from '../support/mail-catcher'

// Two app instances on one database, as behind a load balancer: A is the suite's server, B a
// second copy of the same build with the same secret (startAppServer's) on its own port, pointed
// at databaseUrl2 (another Galera node in `npm run test:cluster`, else the same database).
let db: Knex
let b: AppServer
const A = () => inject('baseUrl')
const started = new Date(Date.now() - 1000)

beforeAll(async () => {
  db = testDb()
  b = await startAppServer(inject('databaseUrl2'), {
    NUXT_SMTP_URL: `smtp://127.0.0.1:${inject('mailPort')}`, NUXT_MAIL_POLL_MS: '200', NUXT_MAIL_CATCHER_DIR: inject('mailDir'), NUXT_PUBLIC_MAIL_CATCHER: 'true'
  })
})
afterAll(async () => {
  await db('sign_in_attempts').where('scope_key', 'like', 'account:two-instances-%').orWhere(q => q.where({ scope_key: 'address:127.0.0.1' }).where('attempted_at', '>=', started)).delete()
  await stopAppServer(b)
  await db.destroy()
})

async function call<T = unknown>(base: string, path: string, init: { method?: string, cookie?: string, body?: unknown } = {}): Promise<{ status: number, body: T, cookie: string | null }> {
  const res = await fetch(`${base}${path}`, {
    method: init.method ?? 'GET',
    headers: { accept: 'application/json', ...(init.body === undefined ? {} : { 'content-type': 'application/json' }), ...(init.cookie ? { cookie: init.cookie } : {}) },
    body: init.body === undefined ? undefined : JSON.stringify(init.body)
  })
  const text = await res.text()
  const cookie = res.headers.getSetCookie().find(c => c.startsWith('rw_session='))?.split(';')[0] ?? null
  let body: unknown = text
  try {
    body = JSON.parse(text)
  } catch {
    // not JSON
  }
  return { status: res.status, body: body as T, cookie }
}

async function signInOn(base: string, email: string): Promise<string> {
  const res = await call(base, '/api/auth/login', { method: 'POST', body: { email, password: DEMO_PASSWORD } })
  expect(res.status).toBe(200)
  return res.cookie!
}

const jobInput = {
  spec: {
    bits: 16, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5,
    yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, refSourceOhm: 0, powerBudgetW: 1e-3
  },
  process: {
    sheetOhmPerSq: 1000, matchingPctUm: 1.0, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 50, switchSkewS: 1e-10,
    switchChargeC: 1e-15, switchAreaUm2: 4, gateAreaUm2: 2, layoutOverhead: 2, minWidthUm: 0.4, minLengthUm: 1
  },
  options: { trials: 6000, seed: 3, inlDefinition: 'endpoint' }
}

describe('two app instances on one database', () => {
  it('accepts a session from one instance on the other, and a sign-out on either ends it on both', async () => {
    const cookie = await signInOn(A(), DEMO.engineer)
    expect((await call<{ email: string }>(b.url, '/api/auth/session', { cookie })).body.email).toBe(DEMO.engineer)
    const created = await call<{ id: number }>(b.url, '/api/studies', { method: 'POST', cookie, body: { title: 'Made on instance B', spec: jobInput.spec } })
    expect(created.status).toBe(201)
    expect((await call<{ title: string }>(A(), `/api/studies/${created.body.id}`, { cookie })).body.title).toBe('Made on instance B')
    expect((await call(b.url, '/api/auth/logout', { method: 'POST', cookie })).status).toBeLessThan(300)
    expect((await call(A(), '/api/studies', { cookie })).status).toBe(401)
    expect((await call(b.url, '/api/studies', { cookie })).status).toBe(401)
  })

  it('counts failed sign-ins of both instances against one limit (5 per account per 15 minutes)', async () => {
    const email = `two-instances-${Date.now()}@harrowlake.example`
    const statuses = []
    for (const base of [A(), b.url, A(), b.url, A(), b.url, A()]) {
      statuses.push((await call(base, '/api/auth/login', { method: 'POST', body: { email, password: 'wrong-password' } })).status)
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429, 429])
  })

  it('sends a burst of queued mail exactly once although both instances drain the outbox', async () => {
    const admin = await signInOn(A(), DEMO.admin)
    const tag = `burst-${Date.now()}`
    const emails = Array.from({ length: 30 }, (_, i) => `${tag}-${i}@harrowlake.example`)
    const answers = await Promise.all(emails.map((email, i) => call(i % 2 ? b.url : A(), '/api/team/invitations', { method: 'POST', cookie: admin, body: { email, name: `Burst ${i}`, role: 'engineer' } })))
    expect(answers.map(r => r.status)).toEqual(emails.map(() => 201))
    const deadline = Date.now() + 30_000
    const countOf = () => caughtMail(inject('mailDir')).filter(m => m.to.some(t => t.includes(tag))).length
    while (countOf() < emails.length && Date.now() < deadline) await new Promise(r => setTimeout(r, 200))
    // A few more polling rounds of both senders: a second send would show up now.
    await new Promise(r => setTimeout(r, 1500))
    const caught = caughtMail(inject('mailDir')).flatMap(m => m.to).filter(t => t.includes(tag))
    expect(caught.length).toBe(emails.length)
    expect(new Set(caught).size).toBe(emails.length)
    const rows = await db('mail_outbox').whereIn('to_address', emails).select('status', 'attempts')
    expect(rows.every(r => r.status === 'sent' && r.attempts === 1)).toBe(true)
  })

  it('shows and cancels on one instance an evaluation job started on the other, and keeps the per-user cap across both', async () => {
    const engineer = await signInOn(A(), DEMO.engineer)
    await db('evaluations').whereIn('status', ['queued', 'running']).update({ status: 'cancelled' })
    const first = await call<{ id: number }>(A(), '/api/evaluations', { method: 'POST', cookie: engineer, body: jobInput })
    const second = await call<{ id: number }>(A(), '/api/evaluations', { method: 'POST', cookie: engineer, body: jobInput })
    expect([first.status, second.status]).toEqual([202, 202])
    expect((await call(b.url, '/api/evaluations', { method: 'POST', cookie: engineer, body: jobInput })).status).toBe(429)
    const seen = await call<{ status: string, userId: number }>(b.url, `/api/evaluations/${first.body.id}?result=0`, { cookie: engineer })
    expect(seen.status).toBe(200)
    expect(['queued', 'running', 'done']).toContain(seen.body.status)
    const cancelled = await call<{ status: string }>(b.url, `/api/evaluations/${first.body.id}`, { method: 'DELETE', cookie: engineer })
    expect(cancelled.status).toBe(200)
    expect(cancelled.body.status).toBe('cancelled')
    expect((await call<{ status: string }>(A(), `/api/evaluations/${first.body.id}?result=0`, { cookie: engineer })).body.status).toBe('cancelled')
    // The slot is free on both instances, and the instance running the job does not overwrite the cancel.
    const third = await call<{ id: number }>(b.url, '/api/evaluations', { method: 'POST', cookie: engineer, body: jobInput })
    expect(third.status).toBe(202)
    await new Promise(r => setTimeout(r, 1000))
    expect((await call<{ status: string }>(A(), `/api/evaluations/${first.body.id}?result=0`, { cookie: engineer })).body.status).toBe('cancelled')
    await db('evaluations').whereIn('status', ['queued', 'running']).update({ status: 'cancelled', finished_at: new Date() })
  })
})
