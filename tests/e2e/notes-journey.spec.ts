import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { expectAccessible, launchBrowser, signedInPage } from '../support/browser'
import { api, DEMO, signIn } from '../support/http'
import { caughtMail } from '../support/mail-catcher'

const SHOTS = join(process.cwd(), 'tests/e2e/screenshots')
// An 8-bit spec invented for the journey.
const SPEC = { bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }
const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }
/** polls wait this long: a write and its reload can take seconds on a busy shared machine */
const WAIT = { timeout: 30_000 }
let browser: Browser
let close: () => Promise<void>

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true })
  ;({ browser, close } = await launchBrowser())
})
afterAll(async () => {
  await close()
})

describe('notes journey', () => {
  it('an engineer notes a candidate mentioning an architect, who is mailed, replies and resolves it', async () => {
    const title = `Notes journey ${Date.now()}`
    const cookie = await signIn(DEMO.engineer)
    const created = await api<{ id: number }>('/api/studies', { method: 'POST', cookie, body: { title, spec: SPEC } })
    const saved = await api(`/api/studies/${created.body.id}/revisions`, { method: 'POST', cookie, body: { baseVersion: 0, spec: SPEC, process: PROCESS, options: { topologies: ['string', 'r2r-voltage', 'segmented'], trials: 200, seed: 1 } } })
    expect(saved.status).toBe(201)
    const path = `/studies/${created.body.id}`

    const engineer = await signedInPage(browser, inject('baseUrl'), DEMO.engineer, path)
    await engineer.getByTestId('candidates-table').waitFor({ timeout: 60_000 })
    const marker = engineer.locator('[data-note-marker]').first()
    const candidateId = (await marker.getAttribute('data-note-marker'))!
    await marker.click()
    const box = engineer.getByLabel(`New note on candidate ${candidateId}`)
    await box.pressSequentially('Is this small enough for the budget, @arch')
    await engineer.getByRole('option', { name: /Tomas Reyne/ }).click()
    await box.pressSequentially('? See **area**.')
    await engineer.getByRole('button', { name: 'Add note' }).click()
    const thread = engineer.locator('[data-thread]').first()
    await expect.poll(() => thread.textContent(), WAIT).toContain('Is this small enough for the budget, @architect ? See area.')
    expect(await thread.locator('strong').textContent()).toBe('area')
    await expect.poll(() => engineer.locator(`[data-note-marker="${candidateId}"]`).getAttribute('aria-label'), WAIT).toContain('1 open note')
    await engineer.getByTestId('study-notes').screenshot({ path: `${SHOTS}/notes-engineer-1280.png` })
    await engineer.getByTestId('candidates-table').screenshot({ path: `${SHOTS}/notes-markers-1280.png` })
    await engineer.screenshot({ path: `${SHOTS}/notes-page-1280.png`, fullPage: true })
    await expectAccessible(engineer)

    // the architect is mailed once, with a link to the note
    let link = ''
    for (let i = 0; i < 100 && !link; i++) {
      const mail = caughtMail(inject('mailDir')).find(m => m.subject.includes(title) && m.to.includes(DEMO.architect))
      link = /\/studies\/\d+#note-\d+/.exec(mail?.text ?? '')?.[0] ?? ''
      if (!link) await new Promise(r => setTimeout(r, 200))
    }
    expect(link).toBe(`${path}#note-${await thread.getAttribute('data-thread')}`)

    const architect = await signedInPage(browser, inject('baseUrl'), DEMO.architect, path, 390)
    const seen = architect.locator('[data-thread]').first()
    await expect.poll(() => seen.textContent(), { timeout: 30_000 }).toContain('Is this small enough')
    await seen.getByRole('button', { name: 'Reply' }).click()
    await seen.getByLabel('Reply').fill('It is, with 20 % to spare; keep it.')
    await seen.getByRole('button', { name: 'Reply', exact: true }).click()
    await expect.poll(() => seen.textContent(), WAIT).toContain('with 20 % to spare')
    await seen.getByRole('button', { name: 'Resolve' }).click()
    await expect.poll(() => architect.getByTestId('notes-empty').textContent(), WAIT).toContain('No open notes')
    await architect.getByLabel('Resolved').check()
    await expect.poll(() => architect.locator('[data-thread]').first().textContent(), WAIT).toContain('Resolved by Tomas Reyne')
    await architect.getByTestId('study-notes').screenshot({ path: `${SHOTS}/notes-architect-390.png` })
    await expectAccessible(architect)
    await architect.context().close()

    // back on the engineer's page the thread is resolved after a reload
    await engineer.reload()
    await engineer.getByTestId('study-notes').waitFor()
    // a check that lands before the page has hydrated is lost: check again until the list answers
    await expect.poll(async () => {
      await engineer.getByLabel('All').check()
      return await engineer.locator('[data-thread]').first().getAttribute('data-resolved', { timeout: 2_000 }).catch(() => null)
    }, { timeout: 60_000 }).toBe('yes')
    await engineer.context().close()
  }, 300_000)
})
