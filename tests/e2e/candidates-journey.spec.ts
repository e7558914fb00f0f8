import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { expectAccessible, launchBrowser, signedInPage } from '../support/browser'
import { DEMO } from '../support/http'

const SHOTS = join(process.cwd(), 'tests/e2e/screenshots')
const STUDY = 'Bridge-sensor trim DAC, 12 bit'
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
const line = (page: Page, candidate: string, id: string) => page.locator(`[data-testid="candidates-table"] tr[data-candidate="${candidate}"] [data-line="${id}"]`)

async function setField(page: Page, label: string, value: string) {
  await field(page, label).fill(value)
  await field(page, label).blur()
}

describe('candidates: live comparison → Monte Carlo → revisions', () => {
  it('updates the live table as a target typed with units changes', async () => {
    const page = await signedIn(DEMO.architect, '/studies')
    await page.getByRole('link', { name: STUDY }).click()
    await page.waitForURL(/\/studies\/\d+$/)
    studyUrl = new URL(page.url()).pathname
    await expect.poll(() => page.getByTestId('live-state').textContent(), { timeout: 20_000 }).toContain('up to date')
    // Demo preset 1 and the 12-bit demo spec: the buffered two-stage string exceeds the 50 pV·s glitch limit (engine verdict).
    expect(await line(page, 'two-stage-buffered', 'glitch').getAttribute('data-state')).toBe('fail')
    await setField(page, 'Glitch limit', '20 nV·s')
    await expect.poll(() => line(page, 'two-stage-buffered', 'glitch').getAttribute('data-state'), { timeout: 20_000 }).not.toBe('fail')
    await expect.poll(() => page.locator('tr[data-recommended]').getAttribute('data-candidate')).toBe('two-stage-buffered')
    await page.screenshot({ path: `${SHOTS}/candidates-live-1280.png`, fullPage: true })
    await expectAccessible(page)

    await page.getByTestId('mc-run').click()
    await page.getByTestId('mc-progress').waitFor({ timeout: 10_000 })
    await expect.poll(() => page.getByTestId('mc-status').textContent(), { timeout: 60_000 }).toContain('done for these inputs')
    expect(await page.getByTestId('source-monte-carlo').isChecked()).toBe(true)
    await expect.poll(() => page.getByTestId('chart-inl-summary').textContent()).toContain('Widest envelope')
    await page.locator('[data-testid="chart-inl"] .apexcharts-canvas').waitFor()
    await page.screenshot({ path: `${SHOTS}/candidates-monte-carlo-1280.png`, fullPage: true })
    // The per-code charts come from the engine: the DNL envelope of sampled circuits after the run, the analytic yield curve with the MC dot.
    await expect.poll(() => page.getByTestId('chart-dnl-summary').textContent()).toContain('light bands: Monte Carlo envelope')
    expect(await page.getByTestId('chart-yield-summary').textContent()).toContain('Dots are the Monte Carlo yield')
    for (const id of ['chart-dnl', 'chart-transfer', 'chart-yield']) {
      await page.locator(`[data-testid="${id}"] .apexcharts-canvas`).waitFor()
      await page.getByTestId(id).screenshot({ path: `${SHOTS}/${id}-1280.png` })
    }
    await expectAccessible(page)

    await page.getByLabel('What changed').fill('Glitch limit relaxed to 20 nV·s')
    await page.getByRole('button', { name: 'Save revision' }).click()
    await expect.poll(() => page.getByTestId('study-version').textContent()).toContain('revision 2')
    // The finished Monte Carlo run of exactly these inputs is kept with the revision.
    await expect.poll(() => page.getByText(/Revision 2\b/).first().locator('..').textContent()).toContain('with results')
    // Every headline number opens its derivation with the user's values substituted.
    await page.getByTestId('candidate-explain').waitFor()
    expect(await page.getByTestId('candidate-explain').textContent()).toContain('How the numbers of')
    // A ladder names the switch design the engine chose for it, beside the other handlings (handbook §11).
    await page.locator('[data-candidate="r2r-voltage"] button[aria-pressed]').click()
    await expect.poll(() => page.getByTestId('switch-design').textContent()).toContain('Chosen by the engine')
    await page.getByTestId('switch-design').screenshot({ path: `${SHOTS}/switch-design-1280.png` })
    await setField(page, 'INL target', '0.75 LSB')
    await expect.poll(() => page.getByTestId('source-live').isChecked()).toBe(true)
    await expect.poll(() => page.getByTestId('live-state').textContent(), { timeout: 20_000 }).toContain('up to date')
    await page.getByRole('button', { name: 'Save revision' }).click()
    await expect.poll(() => page.getByTestId('study-version').textContent()).toContain('revision 3')
    await page.getByLabel('Compare revision').selectOption('2')
    await page.getByLabel('with revision').selectOption('3')
    await page.getByTestId('compare-revisions').click()
    await expect.poll(() => page.getByTestId('revision-compare').textContent()).toContain('INL target')
    // Ranking weights belong to the study record: a change makes the study unsaved, the revision keeps it.
    await page.locator('#weight-glitch').fill('6')
    await expect.poll(() => page.getByTestId('save-state').textContent()).toContain('nsaved')
    await page.getByRole('button', { name: 'Save revision' }).click()
    await expect.poll(() => page.getByTestId('study-version').textContent()).toContain('revision 4')
    await page.reload()
    await expect.poll(() => page.locator('#weight-glitch').inputValue(), { timeout: 20_000 }).toBe('6')
    await page.context().close()
    // the whole journey (Monte Carlo, three saves, a reload) runs longer than the default test time on a busy machine
  }, 300_000)

  it('opens a finding\'s handbook section, readable at 1280 and 390 px', async () => {
    const page = await signedIn(DEMO.architect, studyUrl)
    await expect.poll(() => page.getByTestId('live-state').textContent(), { timeout: 20_000 }).toContain('up to date')
    const link = page.locator('[data-basis="handbook"] a').first()
    const section = await link.getAttribute('data-section')
    await link.click()
    await page.waitForURL(/\/handbook#section-/)
    await page.locator(`section[data-section="${section}"]`).waitFor()
    await page.screenshot({ path: `${SHOTS}/handbook-1280.png` })
    await expectAccessible(page)
    await page.context().close()
    const narrow = await signedIn(DEMO.engineer, '/handbook', 390)
    await narrow.getByTestId('handbook').waitFor()
    await narrow.screenshot({ path: `${SHOTS}/handbook-390.png` })
    await expectAccessible(narrow)
    await narrow.context().close()
  })

  it('cancels a long Monte Carlo run and keeps the live comparison', async () => {
    const page = await signedIn(DEMO.architect, studyUrl)
    await expect.poll(() => page.getByTestId('live-state').textContent(), { timeout: 20_000 }).toContain('up to date')
    await setField(page, 'Monte Carlo trials', '100000')
    await expect.poll(() => page.getByTestId('live-state').textContent(), { timeout: 20_000 }).toContain('up to date')
    await page.getByTestId('mc-run').click()
    await page.getByTestId('mc-progress').waitFor({ timeout: 10_000 })
    await page.getByTestId('mc-cancel').click()
    await expect.poll(() => page.getByTestId('mc-status').textContent()).toContain('cancelled')
    expect(await page.getByTestId('mc-run').isEnabled()).toBe(true)
    expect(await page.getByTestId('source-live').isChecked()).toBe(true)
    await page.context().close()
  })

  it('is readable at 390 px and passes axe', async () => {
    const page = await signedIn(DEMO.engineer, studyUrl, 390)
    await expect.poll(() => page.getByTestId('live-state').textContent(), { timeout: 20_000 }).toContain('up to date')
    await page.locator('[data-testid="chart-glitch"] .apexcharts-canvas').waitFor()
    await page.screenshot({ path: `${SHOTS}/candidates-390.png`, fullPage: true })
    for (const id of ['chart-dnl', 'chart-transfer', 'chart-yield']) {
      await page.locator(`[data-testid="${id}"] .apexcharts-canvas`).waitFor()
      await page.getByTestId(id).screenshot({ path: `${SHOTS}/${id}-390.png` })
    }
    await expectAccessible(page)
    await page.context().close()
  })
})
