import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { expectAccessible, launchBrowser, signedInPage } from '../support/browser'
import { DEMO } from '../support/http'
import { caughtMail } from '../support/mail-catcher'

const SHOTS = join(process.cwd(), 'tests/e2e/screenshots')
const TITLE = `Review journey ${Date.now()}`
let browser: Browser
let close: () => Promise<void>
let studyUrl = ''

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true })
  ;({ browser, close } = await launchBrowser())
})
afterAll(async () => {
  await close()
})

function signedIn(email: string, path: string, width = 1280): Promise<Page> {
  return signedInPage(browser, inject('baseUrl'), email, path, width)
}

const field = (page: Page, label: string) => page.getByLabel(label, { exact: true })
const mailCount = (to: string, subject: string) => caughtMail(inject('mailDir')).filter(m => m.to.includes(to) && m.subject === subject).length

async function shoot(page: Page, name: string) {
  await page.screenshot({ path: `${SHOTS}/${name}.png`, fullPage: true })
  await expectAccessible(page)
}

/**
 * Four browser sessions, one per role: the engineer drafts and asks for review, the architect
 * writes a note and signs off with a comment, the admin records the decision, the manager reads the portfolio and
 * prints the brief, which lists the architect's open note.
 */
describe('review journey: draft → review → sign-off → decision → brief', () => {
  it('engineer: creates a study, saves a revision with Monte Carlo results and asks the architect for review', async () => {
    const page = await signedIn(DEMO.engineer, '/studies/new')
    await page.getByLabel('Title').fill(TITLE)
    await page.getByRole('button', { name: 'Create study' }).click()
    await page.waitForURL(/\/studies\/\d+$/)
    studyUrl = new URL(page.url()).pathname
    await page.getByLabel('Process preset').selectOption({ label: 'Demo 180 nm — silicide-blocked poly (demo data)' })
    await page.getByTestId('apply-preset').click()
    await field(page, 'Monte Carlo trials').fill('200')
    await field(page, 'Monte Carlo trials').blur()
    await expect.poll(() => page.getByTestId('live-state').textContent(), { timeout: 30_000 }).toContain('up to date')
    await page.getByTestId('mc-run').click()
    await expect.poll(() => page.getByTestId('mc-status').textContent(), { timeout: 120_000 }).toContain('done for these inputs')
    await page.getByLabel('What changed').fill('First look with Monte Carlo')
    await page.getByRole('button', { name: 'Save revision' }).click()
    await expect.poll(() => page.getByTestId('study-version').textContent()).toContain('revision 1')
    // The engineer may not sign off or decide: the controls stay disabled and say why.
    expect(await page.getByTestId('sign-off').isDisabled()).toBe(true)
    await page.getByLabel('Tomas Reyne').check()
    await page.getByTestId('ask-review').click()
    await expect.poll(() => page.getByTestId('review-status').textContent()).toContain('In review by Tomas Reyne')
    await shoot(page, 'review-requested-1280')
    await page.context().close()
    await expect.poll(() => mailCount(DEMO.architect, `Review requested: ${TITLE}`), { timeout: 20_000 }).toBe(1)
  }, 240_000) // a Monte Carlo run on a shared machine

  it('architect: signs off with a comment', async () => {
    const page = await signedIn(DEMO.architect, studyUrl)
    // The architect annotates the study first: an open note the brief lists under what is open.
    await page.getByLabel(/^New note on/).fill('Settling margin at full scale is the thinnest line; worth a bench check.')
    await page.getByRole('button', { name: 'Add note' }).click()
    await expect.poll(() => page.locator('[data-thread]').first().textContent(), { timeout: 30_000 }).toContain('Settling margin at full scale')
    await page.getByLabel('Review comment').fill('Glitch and area margins read well; signed off on revision 1.')
    await page.getByTestId('sign-off').click()
    await expect.poll(() => page.getByTestId('review-entries').textContent()).toContain('Signed off by Tomas Reyne on revision 1')
    await expect.poll(() => page.getByTestId('study-activity').textContent()).toContain('signed off')
    await shoot(page, 'review-signed-off-1280')
    await page.context().close()
  })

  it('admin: records the decision, which locks the inputs', async () => {
    const page = await signedIn(DEMO.admin, studyUrl)
    await page.getByLabel('Why this candidate').fill('Meets every target with the smallest area; the review found no open risk.')
    // A candidate that fails spec lines is decided only with a waiver for each (none are asked when it meets every line).
    const waivers = page.getByTestId('decision-waivers').locator('input')
    for (let i = 0; i < await waivers.count(); i += 2) {
      await waivers.nth(i).fill('Programme board')
      await waivers.nth(i + 1).fill('accepted for the first silicon')
    }
    await page.getByTestId('record-decision').click()
    await page.getByTestId('decision-banner').waitFor()
    // The study reloads after the decision: the save bar goes and the inputs become read-only.
    await expect.poll(() => page.getByTestId('save-revision').count()).toBe(0)
    await expect.poll(() => field(page, 'Reference voltage').isEditable()).toBe(false)
    await shoot(page, 'review-decided-1280')
    await page.context().close()
    // The decision mail reaches the owner and the reviewer, once each.
    for (const to of [DEMO.engineer, DEMO.architect]) {
      await expect.poll(() => mailCount(to, `Decided: ${TITLE}`), { timeout: 20_000 }).toBe(1)
    }
  })

  it('manager: sees the chosen option in the portfolio, prints the brief on one page and downloads the PDF', async () => {
    const page = await signedIn(DEMO.manager, '/portfolio')
    await page.goto(`/portfolio?status=decided&q=${encodeURIComponent(TITLE)}`)
    const row = page.locator('[data-testid="portfolio-table"] tbody tr').filter({ hasText: TITLE })
    await expect.poll(async () => (await row.getByTestId('chosen-option').textContent({ timeout: 20_000 }))?.trim()).toMatch(/\S/)
    const chosen = (await row.getByTestId('chosen-option').textContent())!.replace(/[✓▲]/, '').trim()
    await shoot(page, 'review-portfolio-1280')
    await row.getByRole('link', { name: 'brief' }).click()
    await page.getByTestId('brief-title').waitFor()
    expect(await page.getByTestId('brief-decision').textContent()).toContain(chosen)
    expect(await page.getByTestId('brief-signoffs').textContent()).toContain('Tomas Reyne')
    expect(await page.locator('main').textContent()).toContain('1 open note')
    await shoot(page, 'brief-1280')
    await page.emulateMedia({ media: 'print' })
    const printed = await page.pdf({ format: 'A4', printBackground: false })
    // Page objects of the printed PDF (ISO 32000-1 §7.7.3.3): exactly one page.
    expect(Buffer.from(printed).toString('latin1').match(/\/Type\s*\/Page\b/g)).toHaveLength(1)
    await page.emulateMedia({ media: 'screen' })
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('brief-pdf').click()])
    expect(download.suggestedFilename()).toMatch(/^rungwise-brief-\d+-Review-journey-\d+\.pdf$/)
    // On the study page a manager reads the decision and the activity; no control changes anything.
    await page.goto(studyUrl)
    await page.getByTestId('study-activity').waitFor()
    expect(await page.getByTestId('review-panel').locator('button').count()).toBe(0)
    expect(await page.getByTestId('save-revision').count()).toBe(0)
    await page.context().close()
  })

  it('reads well at 390 px: the study page and the brief', async () => {
    const page = await signedIn(DEMO.manager, studyUrl, 390)
    await page.getByTestId('decision-banner').waitFor()
    await shoot(page, 'review-decided-390')
    await page.goto(studyUrl.replace('/studies/', '/briefs/'))
    await page.getByTestId('brief-title').waitFor()
    await shoot(page, 'brief-390')
    await page.context().close()
  })
})
