import { describe, expect, inject, it } from 'vitest'
import { api, DEMO, DEMO_PASSWORD, signIn } from '../support/http'
import { startAppServer, stopAppServer } from '../support/app-server'

/**
 * The headers every response carries (nuxt-security, configured in nuxt.config.ts). Expected values
 * are the ones the HTTP and CSP standards define (RFC 6797 for HSTS, CSP Level 3, Fetch for nosniff).
 */
function directives(csp: string): Map<string, string[]> {
  return new Map(csp.split(';').map(d => d.trim()).filter(Boolean).map((d) => {
    const [name, ...values] = d.split(/\s+/)
    return [name!, values]
  }))
}

function expectCommonHeaders(headers: Headers) {
  expect(headers.get('x-content-type-options')).toBe('nosniff')
  expect(headers.get('referrer-policy')).toBe('same-origin')
  expect(headers.get('x-frame-options')).toBe('DENY')
  expect(headers.get('x-powered-by')).toBeNull()
  // Plain http here: no HSTS (a browser would then refuse the http address for months).
  expect(headers.get('strict-transport-security')).toBeNull()
}

describe('security headers', () => {
  it('a page: CSP with a per-request nonce and no inline script allowance, frame-ancestors none', async () => {
    const first = await fetch(`${inject('baseUrl')}/sign-in`)
    const html = await first.text()
    expect(first.status).toBe(200)
    expectCommonHeaders(first.headers)
    const csp = directives(first.headers.get('content-security-policy') ?? '')
    expect(csp.get('frame-ancestors')).toEqual(['\'none\''])
    expect(csp.get('object-src')).toEqual(['\'none\''])
    expect(csp.get('base-uri')).toEqual(['\'none\''])
    expect(csp.get('script-src-attr')).toEqual(['\'none\''])
    const script = csp.get('script-src') ?? []
    expect(script).not.toContain('\'unsafe-inline\'')
    expect(script).not.toContain('\'unsafe-eval\'')
    const nonce = script.find(s => s.startsWith('\'nonce-'))?.slice(7, -1)
    expect(nonce, 'a nonce in script-src').toBeTruthy()
    expect(csp.get('worker-src')).toContain('\'self\'')
    // Every inline <script> in the page carries that nonce, so none of them is refused.
    const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map(m => m[0])
    expect(scripts.length).toBeGreaterThan(0)
    for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`)
    const second = await fetch(`${inject('baseUrl')}/sign-in`)
    expect(second.headers.get('content-security-policy')).not.toContain(nonce!)
  })

  it('an API route carries the same headers', async () => {
    const cookie = await signIn(DEMO.engineer)
    const res = await api('/api/studies', { cookie })
    expect(res.status).toBe(200)
    expectCommonHeaders(res.headers)
    const health = await api('/api/health')
    expectCommonHeaders(health.headers)
  })

  it('the session cookie is httpOnly, SameSite=Lax, expires with the session, and not Secure over http', async () => {
    const res = await api('/api/auth/login', { method: 'POST', body: { email: DEMO.engineer, password: DEMO_PASSWORD } })
    const cookie = res.headers.getSetCookie().find(c => c.startsWith('rw_session='))!
    expect(cookie).toMatch(/; HttpOnly/i)
    expect(cookie).toMatch(/; SameSite=Lax/i)
    expect(cookie).toMatch(/; Max-Age=28800/i)
    expect(cookie).not.toMatch(/; Secure/i)
  })

  it('with NUXT_HTTPS=true: Secure cookie and HSTS on pages and API routes', async () => {
    const server = await startAppServer(inject('databaseUrl'), { NUXT_HTTPS: 'true', NUXT_HSTS_MAX_AGE_S: '600' })
    try {
      const login = await fetch(`${server.url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: DEMO.engineer, password: DEMO_PASSWORD }) })
      expect(login.status).toBe(200)
      expect(login.headers.getSetCookie().find(c => c.startsWith('rw_session='))).toMatch(/; Secure/i)
      for (const path of ['/sign-in', '/api/health']) {
        const res = await fetch(`${server.url}${path}`)
        expect(res.headers.get('strict-transport-security')).toBe('max-age=600; includeSubDomains')
      }
    } finally {
      await stopAppServer(server)
    }
  })
})
