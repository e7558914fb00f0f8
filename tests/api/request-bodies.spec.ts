import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'

/**
 * Issue 13, findings 4 and 10: the body limit holds however the body arrives (RFC 9112 §7.1
 * chunked transfer coding, no Content-Length), signed in or not; JSON routes take JSON only; private
 * answers carry Cache-Control: no-store (RFC 9111 §5.2.2.5); X-Forwarded-Host is not believed from
 * a client that is not a configured proxy.
 */
let db: Knex
let manager: string
let studyId: number
beforeAll(async () => {
  db = testDb()
  manager = await signIn(DEMO.manager)
  studyId = (await db('studies').join('teams', 'teams.id', 'studies.team_id').where('teams.slug', 'harrow-lake').first('studies.id')).id
})
afterAll(async () => {
  await db('sign_in_attempts').where('scope_key', 'like', 'account:chunked-%').delete()
  await db.destroy()
})

/** A JSON text of about `bytes` bytes sent in 64 kB chunks, with no Content-Length. */
function chunkedJson(bytes: number, field: string): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder()
  const filler = encoder.encode('x'.repeat(65_536))
  let sent = 0
  return new ReadableStream({
    pull(controller) {
      if (sent === 0) controller.enqueue(encoder.encode(`{"${field}":"`))
      if (sent >= bytes) {
        controller.enqueue(encoder.encode('"}'))
        controller.close()
        return
      }
      controller.enqueue(filler)
      sent += filler.length
    }
  })
}

async function sendChunked(path: string, body: ReadableStream<Uint8Array>, cookie?: string) {
  const headers: Record<string, string> = { 'content-type': 'application/json', 'accept': 'application/json' }
  if (cookie) headers.cookie = cookie
  const res = await fetch(`${inject('baseUrl')}${path}`, { method: 'POST', headers, body, duplex: 'half' } as RequestInit)
  return { status: res.status, body: await res.text() }
}

describe('request body limit', () => {
  it('refuses a 10 MB chunked body on the signed-out sign-in route with 413', async () => {
    const res = await sendChunked('/api/auth/login', chunkedJson(10_000_000, 'email'))
    expect(res.status).toBe(413)
    expect(res.body).toContain('larger than 8 MB')
    expect((await api('/api/health')).status).toBe(200)
  })

  it('refuses a 10 MB chunked note body of a signed-in user with 413 and stores nothing', async () => {
    const before = Number((await db('notes').count({ n: '*' }))[0]!.n)
    const res = await sendChunked(`/api/studies/${studyId}/notes`, chunkedJson(10_000_000, 'body'), manager)
    expect(res.status).toBe(413)
    expect(Number((await db('notes').count({ n: '*' }))[0]!.n)).toBe(before)
  })

  it('still reads a small chunked body', async () => {
    const small = new Blob([JSON.stringify({ email: DEMO.manager, password: 'harrow-lake-demo' })]).stream()
    expect((await sendChunked('/api/auth/login', small)).status).toBe(200)
  })

  it('refuses a declared length above the limit before reading it', async () => {
    const res = await api('/api/auth/login', { method: 'POST', body: JSON.stringify({ email: 'x'.repeat(9_000_000) }) })
    expect(res.status).toBe(413)
  })
})

describe('JSON routes take JSON', () => {
  it.each([
    ['application/x-www-form-urlencoded', `email=${encodeURIComponent(DEMO.manager)}&password=harrow-lake-demo`],
    ['text/plain', JSON.stringify({ email: DEMO.manager, password: 'harrow-lake-demo' })]
  ])('refuses a %s body with 415, signed out and signed in', async (type, text) => {
    const send = (path: string, body: string, cookie?: string) => fetch(`${inject('baseUrl')}${path}`, { method: 'POST', body, headers: { 'content-type': type, ...(cookie ? { cookie } : {}) } })
    expect((await send('/api/auth/login', text)).status).toBe(415)
    const note = await send(`/api/studies/${studyId}/notes`, type.startsWith('text') ? JSON.stringify({ body: 'form note' }) : 'body=form+note', manager)
    expect(note.status).toBe(415)
  })
})

describe('caching and forwarded hosts', () => {
  it('marks private JSON and downloads no-store', async () => {
    for (const path of ['/api/auth/session', '/api/studies', `/api/studies/${studyId}`, `/api/studies/${studyId}/export`, '/api/portfolio/export']) {
      const res = await api(path, { cookie: manager })
      expect(res.headers.get('cache-control'), path).toBe('no-store')
    }
  })

  it('does not believe X-Forwarded-Host from a client that is not a configured proxy', async () => {
    const res = await api(`/api/studies/${studyId}/notes`, {
      method: 'POST', cookie: manager, body: { body: 'cross-site' },
      headers: { 'origin': 'http://attacker.example', 'x-forwarded-host': 'attacker.example' }
    })
    expect(res.status).toBe(403)
  })
})
