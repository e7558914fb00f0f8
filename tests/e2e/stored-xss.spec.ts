import { createHash, randomBytes } from 'node:crypto'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { matrixPack } from '../api/authorization-rule-packs'
import { SPEC } from '../api/fuzz-table'
import { launchBrowser, newContext, signedInPage } from '../support/browser'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'

/**
 * Stored XSS: markup saved into every free-text field there is today comes back as text. Each
 * payload, if it ran, would set window.__xss (inline script or an onerror handler); the page must
 * show it literally, hold no element it injected, and open no dialog. The DOM check is independent
 * of the CSP, which would block the script anyway: it catches an unescaped render (v-html) too.
 */
const payload = (label: string) => `${label}<img src=x onerror="window.__xss=1"><script>window.__xss=2</script>`
const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }
const tag = Date.now().toString(36)
let browser: Browser
let close: () => Promise<void>
let studyId = 0
let packRowId = 0
let inviteToken = ''

beforeAll(async () => {
  ;({ browser, close } = await launchBrowser())
  const admin = await signIn(DEMO.admin)
  const post = async (path: string, body: unknown) => {
    const res = await api<{ id: number }>(path, { method: 'POST', cookie: admin, body })
    expect(res.status, `${path}: ${JSON.stringify(res.body)}`).toBeLessThan(300)
    return res.body
  }
  studyId = (await post('/api/studies', { title: payload(`xss-title-${tag}`), blockName: payload(`xss-block-${tag}`), spec: SPEC })).id
  await post(`/api/studies/${studyId}/revisions`, { baseVersion: 0, spec: SPEC, process: PROCESS, options: { topologies: ['string'], trials: 0, seed: 1 }, note: payload(`xss-note-${tag}`) })
  await post('/api/presets', { name: payload(`xss-preset-${tag}`), description: payload(`xss-preset-desc-${tag}`), process: PROCESS })
  await post('/api/templates', { name: payload(`xss-template-${tag}`), description: payload(`xss-template-desc-${tag}`), spec: SPEC })
  const pack = matrixPack(`xss-${tag}`)
  pack.name = payload(`xss-pack-${tag}`)
  pack.rules[0]!.title = payload(`xss-rule-${tag}`)
  pack.rules[0]!.explanation = payload(`xss-expl-${tag}`)
  pack.rules[0]!.action = payload(`xss-action-${tag}`)
  packRowId = (await post('/api/rule-packs', { pack, enabled: false })).id
  await post('/api/team/invitations', { email: `xss-open-${tag}@invite.example`, name: payload(`xss-invitee-${tag}`), role: 'engineer' })
  // A member whose name is markup (invited, then accepted), and an open link whose preview shows its name.
  const db = testDb()
  try {
    const team = await db('users').where({ email: DEMO.admin }).first('id', 'team_id')
    const hash = (t: string) => createHash('sha256').update(t).digest('hex')
    const memberToken = randomBytes(32).toString('base64url')
    inviteToken = randomBytes(32).toString('base64url')
    const expires = new Date(Date.now() + 3_600_000)
    await db('invitations').insert([
      { team_id: team.team_id, email: `xss-member-${tag}@invite.example`, display_name: payload(`xss-member-${tag}`), role: 'engineer', token_hash: hash(memberToken), expires_at: expires, invited_by: team.id },
      { team_id: team.team_id, email: `xss-link-${tag}@invite.example`, display_name: payload(`xss-link-${tag}`), role: 'engineer', token_hash: hash(inviteToken), expires_at: expires, invited_by: team.id }
    ])
    expect((await api(`/api/invitations/${memberToken}/accept`, { method: 'POST', body: { password: 'xss-member-password' } })).status).toBe(201)
  } finally {
    await db.destroy()
  }
})
afterAll(async () => {
  await close()
})

/** Waits until every label's payload shows as literal text (or an input's value), then checks nothing ran. */
async function expectInert(page: Page, labels: string[], dialogs: string[]) {
  for (const label of labels) {
    const literal = payload(`${label}-${tag}`)
    await expect.poll(() => page.evaluate(text => document.body.innerText.includes(text)
      || [...document.querySelectorAll('input, textarea, select option')].some(e => ((e as HTMLInputElement).value ?? e.textContent ?? '').includes(text))
      || [...document.querySelectorAll('select option')].some(o => o.textContent?.includes(text)), literal), { timeout: 30_000, message: `${label} shown as text` }).toBe(true)
  }
  const found = await page.evaluate(() => ({
    ran: (window as unknown as { __xss?: string }).__xss ?? null,
    images: document.querySelectorAll('img[src="x"], [onerror]').length,
    // Nuxt's payload (<script type="application/json">) carries the text as JSON data, escaped.
    scripts: [...document.scripts].filter(s => s.type !== 'application/json' && s.textContent?.includes('__xss')).length
  }))
  expect(found).toEqual({ ran: null, images: 0, scripts: 0 })
  expect(dialogs).toEqual([])
}

async function visit(path: string, labels: string[], signedOut = false, act?: (page: Page) => Promise<void>) {
  const page = signedOut ? await (await newContext(browser, inject('baseUrl'))).newPage() : await signedInPage(browser, inject('baseUrl'), DEMO.admin, path)
  const dialogs: string[] = []
  page.on('dialog', (d) => {
    dialogs.push(d.message())
    void d.dismiss()
  })
  if (signedOut) await page.goto(path)
  await act?.(page)
  await expectInert(page, labels, dialogs)
  await page.context().close()
}

describe('stored XSS: markup in free-text fields renders as text', () => {
  it('studies list and portfolio: study title and block', async () => {
    await visit('/studies', ['xss-title', 'xss-block'])
    await visit('/portfolio', ['xss-title'])
  })

  it('study workspace: title, block and the revision note', async () => {
    await visit(`/studies/${studyId}`, ['xss-title', 'xss-note'])
  })

  it('processes and the new-study form: preset and template names and descriptions', async () => {
    await visit('/processes', ['xss-preset', 'xss-preset-desc'])
    await visit('/studies/new', ['xss-template'])
  })

  it('rule packs: pack name, rule title, explanation and action, also in a dry run', async () => {
    await visit('/rule-packs', ['xss-pack'])
    await visit(`/rule-packs/${packRowId}`, ['xss-rule', 'xss-expl', 'xss-action'], false, async (page) => {
      await page.getByRole('button', { name: 'Dry run on the sample study' }).click()
      await page.getByTestId('dry-run-result').waitFor({ timeout: 30_000 })
    })
  })

  it('team: member names and invitation names; the invitation link page', async () => {
    await visit('/team', ['xss-member', 'xss-invitee'])
    await visit(`/invite/${inviteToken}`, ['xss-link'], true)
  })
})
