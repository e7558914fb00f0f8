import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { RevisionDto } from '../../shared/types/revisions'
import { expectAccessible, launchBrowser, signedInPage } from '../support/browser'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'

/**
 * The screen shows the truth first (issue 12): a decided study opens on the decision's revision
 * with the decision in view, and a Monte Carlo run on unchanged inputs can be saved. The expected
 * states are the product's rules (common practice, no source); no engine number is pinned.
 */
const SHOTS = join(process.cwd(), 'tests/e2e/screenshots')
const TAG = `Truth journey ${Date.now()}`
const SPEC = {
  bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5,
  yieldTarget: 0.99, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, refSourceOhm: 0, powerBudgetW: 1e-3
}
const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 5 }
let browser: Browser
let close: () => Promise<void>
let decidedUrl = ''
let chosenId = ''

async function finishedJob(cookie: string, spec: object, options: object) {
  const job = await api<{ id: number }>('/api/evaluations', { method: 'POST', cookie, body: { spec, process: PROCESS, options } })
  let status = ''
  for (let i = 0; i < 1200 && status !== 'done'; i++) {
    status = (await api<{ status: string }>(`/api/evaluations/${job.body.id}`, { cookie })).body.status
    if (status !== 'done') await new Promise(r => setTimeout(r, 100))
  }
  expect(status).toBe('done')
  return job.body.id
}

/** A study saved with Monte Carlo results (through the API), asked for review and signed off by the architect. */
async function signedOffStudy(title: string, spec: object) {
  const [engineer, architect] = await Promise.all([signIn(DEMO.engineer), signIn(DEMO.architect)])
  const created = await api<{ id: number }>('/api/studies', { method: 'POST', cookie: engineer, body: { title, spec } })
  const evaluationId = await finishedJob(engineer, spec, { trials: 100, seed: 9 })
  const db = testDb()
  const row = await db('evaluations').where({ id: evaluationId }).first('input')
  const input = typeof row.input === 'string' ? JSON.parse(row.input) : row.input
  const architectId = (await db('users').where({ email: DEMO.architect }).first('id')).id
  await db.destroy()
  const saved = await api<RevisionDto>(`/api/studies/${created.body.id}/revisions`, { method: 'POST', cookie: engineer, body: { baseVersion: 0, ...input, evaluationId } })
  expect(saved.status, JSON.stringify(saved.body)).toBe(201)
  await api(`/api/studies/${created.body.id}/review-request`, { method: 'POST', cookie: engineer, body: { statusVersion: 0, reviewerIds: [architectId] } })
  const signed = await api<{ entries: { id: number, kind: string }[] }>(`/api/studies/${created.body.id}/reviews`, { method: 'POST', cookie: architect, body: { statusVersion: 1, verdict: 'signed_off' } })
  return { id: created.body.id, revision: saved.body, architect, signOffIds: signed.body.entries.filter(e => e.kind === 'signed_off').map(e => e.id) }
}

/** A study decided through the API on a candidate other than the recommended one when there is one (with its waivers). */
async function decidedStudy(): Promise<void> {
  const { id, revision, architect, signOffIds } = await signedOffStudy(`${TAG} decided`, SPEC)
  const candidates = revision.results!.candidates
  const chosen = candidates.find(c => c.id !== revision.recommendation?.candidateId) ?? candidates[0]!
  chosenId = chosen.id
  const waivers = chosen.failing.map(line => ({ line, by: 'Programme board', reason: 'accepted for the evaluation chip' }))
  const decided = await api(`/api/studies/${id}/decision`, { method: 'POST', cookie: architect, body: { statusVersion: 2, candidateId: chosen.id, rationale: 'Chosen for the journey.', revision: 1, signOffIds, waivers } })
  expect(decided.status, JSON.stringify(decided.body)).toBe(201)
  decidedUrl = `/studies/${id}`
}

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true })
  ;({ browser, close } = await launchBrowser())
  await decidedStudy()
}, 240_000)
afterAll(async () => {
  await close()
})

function signedIn(email: string, path: string, width = 1280): Promise<Page> {
  return signedInPage(browser, inject('baseUrl'), email, path, width)
}

async function shoot(page: Page, name: string) {
  await page.screenshot({ path: `${SHOTS}/${name}.png`, fullPage: true })
  await expectAccessible(page)
}

describe('the truth first', () => {
  it('opens a decided study on the decision\'s saved numbers, with the decision in view', async () => {
    for (const width of [1280, 390]) {
      const page = await signedIn(DEMO.manager, decidedUrl, width)
      await page.getByTestId('basis-saved').waitFor({ timeout: 30_000 })
      expect(await page.getByTestId('source-saved').isChecked()).toBe(true)
      expect(await page.getByTestId('basis-decision').textContent()).toContain('Decided on this revision')
      expect(await page.getByTestId('basis-live-over-saved').count()).toBe(0)
      // the chosen candidate is marked in the table; the live preview never outlines another one over it
      const row = page.locator(`[data-testid="candidates-table"] tr[data-candidate="${chosenId}"]`)
      await row.getByTestId('chosen-mark').waitFor()
      await page.getByTestId('decision-banner').waitFor()
      await shoot(page, `truth-decided-${width}`)
      await page.context().close()
    }
  }, 300_000) // two widths of a page with charts, on a shared machine

  it('saves a Monte Carlo run made on unchanged inputs', async () => {
    const page = await signedIn(DEMO.engineer, '/studies/new')
    await page.getByLabel('Title').fill(`${TAG} unchanged`)
    await page.getByRole('button', { name: 'Create study' }).click()
    await page.waitForURL(/\/studies\/\d+$/)
    await page.getByLabel('Process preset').selectOption({ label: 'Demo 180 nm — silicide-blocked poly (demo data)' })
    await page.getByTestId('apply-preset').click()
    await page.getByLabel('Monte Carlo trials', { exact: true }).fill('200')
    await page.getByLabel('Monte Carlo trials', { exact: true }).blur()
    await expect.poll(() => page.getByTestId('live-state').textContent(), { timeout: 30_000 }).toContain('up to date')
    await page.getByRole('button', { name: 'Save revision' }).click()
    await expect.poll(() => page.getByTestId('study-version').textContent()).toContain('revision 1')
    // inputs only: the page says why there are no saved numbers, and there is nothing to save
    await page.getByTestId('basis-inputs-only').waitFor()
    expect(await page.getByTestId('save-revision').isDisabled()).toBe(true)
    await shoot(page, 'truth-inputs-only-1280')
    await page.getByTestId('mc-run').click()
    await expect.poll(() => page.getByTestId('mc-status').textContent(), { timeout: 120_000 }).toContain('done for these inputs')
    await page.getByTestId('basis-monte-carlo').waitFor()
    await expect.poll(() => page.getByTestId('save-revision').isDisabled()).toBe(false)
    expect(await page.getByTestId('save-state').textContent()).toContain('Monte Carlo results not saved yet')
    await page.getByRole('button', { name: 'Save revision' }).click()
    await expect.poll(() => page.getByTestId('study-version').textContent(), { timeout: 30_000 }).toContain('revision 2')
    // the run on screen is now the saved results, and says so
    await page.getByTestId('basis-saved').waitFor()
    await shoot(page, 'truth-saved-1280')
    await page.context().close()
  }, 300_000)

  it('decides on a failing candidate only with a waiver per failing line, and shows them in the study, brief and portfolio', async () => {
    // An area budget of 1e-4 mm² (100 µm²) no 8-bit resistor DAC fits: every candidate fails at least the area line.
    const title = `${TAG} waived`
    const { id } = await signedOffStudy(title, { ...SPEC, areaBudgetMm2: 1e-4 })
    const page = await signedIn(DEMO.admin, `/studies/${id}`)
    await page.getByTestId('decision-waivers').waitFor({ timeout: 30_000 })
    await page.getByLabel('Why this candidate').fill('The smallest option; the area budget is being renegotiated.')
    expect(await page.getByTestId('record-decision').isDisabled()).toBe(true)
    const fields = page.getByTestId('decision-waivers').locator('input')
    for (let i = 0; i < await fields.count(); i += 2) {
      await fields.nth(i).fill('Programme board')
      await fields.nth(i + 1).fill('budget to be raised for the test chip')
    }
    await page.getByTestId('review-decision').scrollIntoViewIfNeeded()
    await shoot(page, 'truth-waivers-form-1280')
    await expect.poll(() => page.getByTestId('record-decision').isDisabled()).toBe(false)
    await page.getByTestId('record-decision').click()
    await expect.poll(() => page.getByTestId('decision-banner').textContent(), { timeout: 30_000 }).toContain('waiver')
    expect(await page.getByTestId('decision-waivers-shown').textContent()).toContain('budget to be raised for the test chip')
    await page.context().close()
    for (const width of [1280, 390]) {
      const brief = await signedIn(DEMO.manager, `/briefs/${id}`, width)
      expect(await brief.getByTestId('brief-waivers').textContent()).toContain('waived by Programme board')
      await shoot(brief, `truth-brief-${width}`)
      await brief.goto(`/portfolio?q=${encodeURIComponent(TAG)}`)
      const row = brief.locator('[data-testid="portfolio-table"] tbody tr').filter({ hasText: title })
      await expect.poll(() => row.getByTestId('portfolio-waivers').textContent(), { timeout: 20_000 }).toContain('waived')
      await shoot(brief, `truth-portfolio-${width}`)
      await brief.context().close()
    }
  }, 300_000)
})
