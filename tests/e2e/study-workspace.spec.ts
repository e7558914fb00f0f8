import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { expectAccessible, launchBrowser, signedInPage } from '../support/browser'
import { DEMO } from '../support/http'

const SHOTS = join(process.cwd(), 'tests/e2e/screenshots')
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

describe('study workspace: spec with units → revisions → compare → concurrent save', () => {
  it('shows a unit error in place, then creates the study from a spec typed with units', async () => {
    const page = await signedIn(DEMO.engineer, '/studies/new')
    await page.getByLabel('Title').fill(`Workspace journey ${Date.now()}`)
    await field(page, 'Reference voltage').fill('2 kohm')
    await field(page, 'Update rate').click()
    await expect.poll(() => page.getByTestId('error-spec-vrefV').textContent()).toContain('must be a voltage in V')
    await page.screenshot({ path: `${SHOTS}/new-study-unit-error-1280.png`, fullPage: true })
    await expectAccessible(page)
    await field(page, 'Reference voltage').fill('3.3 V')
    await field(page, 'Update rate').fill('250 kS/s')
    await field(page, 'Update rate').blur()
    expect(await page.getByTestId('error-spec-vrefV').count()).toBe(0)
    await page.getByRole('button', { name: 'Create study' }).click()
    await page.waitForURL(/\/studies\/\d+$/)
    studyUrl = new URL(page.url()).pathname
    await page.context().close()
  })

  it('saves revision 1 from a preset, edits, saves revision 2 and compares the two', async () => {
    const page = await signedIn(DEMO.engineer, studyUrl)
    expect(await page.getByTestId('study-version').textContent()).toContain('no revision saved yet')
    expect(await field(page, 'Update rate').inputValue()).toBe('250 kS/s')
    await page.getByLabel('Process preset').selectOption({ label: 'Demo 180 nm — silicide-blocked poly (demo data)' })
    await page.getByTestId('apply-preset').click()
    expect(await field(page, 'Matching coefficient').inputValue()).toBe('0.8 %·µm')
    await page.getByRole('button', { name: 'Save revision' }).click()
    await expect.poll(() => page.getByTestId('study-version').textContent()).toContain('revision 1')
    await field(page, 'Reference voltage').fill('2.5')
    await field(page, 'Reference voltage').blur()
    expect(await field(page, 'Reference voltage').inputValue()).toBe('2.5 V')
    await expect.poll(() => page.getByTestId('save-state').textContent()).toContain('Unsaved changes')
    await page.getByLabel('What changed').fill('Lower reference')
    await page.getByRole('button', { name: 'Save revision' }).click()
    await expect.poll(() => page.getByTestId('study-version').textContent()).toContain('revision 2')
    await expect.poll(() => page.getByTestId('revision-list').textContent()).toContain('Lower reference')
    await page.getByLabel('Compare revision').selectOption('1')
    await page.getByLabel('with revision').selectOption('2')
    await page.getByTestId('compare-revisions').click()
    const compare = page.getByTestId('revision-compare')
    await expect.poll(() => compare.textContent()).toContain('Reference voltage')
    expect(await compare.textContent()).toMatch(/3\.3 V\s*2\.5 V/)
    await page.screenshot({ path: `${SHOTS}/study-compare-1280.png`, fullPage: true })
    await expectAccessible(page)
    await page.context().close()
  })

  it('refuses a save on a stale revision, then reloads the latest and re-applies the edits', async () => {
    const mine = await signedIn(DEMO.engineer, studyUrl)
    const theirs = await signedIn(DEMO.architect, studyUrl)
    await field(theirs, 'INL target').fill('1 LSB')
    await theirs.getByRole('button', { name: 'Save revision' }).click()
    await expect.poll(() => theirs.getByTestId('study-version').textContent()).toContain('revision 3')
    await field(mine, 'DNL target').fill('0.25 LSB')
    await mine.getByRole('button', { name: 'Save revision' }).click()
    await expect.poll(() => mine.getByTestId('conflict').textContent()).toContain('Someone else saved first')
    await mine.screenshot({ path: `${SHOTS}/study-conflict-1280.png`, fullPage: true })
    await mine.getByTestId('reload-reapply').click()
    await expect.poll(() => field(mine, 'INL target').inputValue()).toBe('1 LSB')
    expect(await field(mine, 'DNL target').inputValue()).toBe('0.25 LSB')
    await mine.getByRole('button', { name: 'Save revision' }).click()
    await expect.poll(() => mine.getByTestId('study-version').textContent()).toContain('revision 4')
    await theirs.context().close()
    await mine.context().close()
  })

  it('asks before leaving with unsaved changes and stays when told to', async () => {
    const page = await signedIn(DEMO.engineer, studyUrl)
    await field(page, 'Power budget').fill('2 mW')
    let asked = ''
    page.once('dialog', (dialog) => {
      asked = dialog.message()
      void dialog.dismiss()
    })
    await page.getByRole('link', { name: 'Studies', exact: true }).click()
    await expect.poll(() => asked).toContain('unsaved changes')
    expect(new URL(page.url()).pathname).toBe(studyUrl)
    await page.context().close()
  })

  it('is usable at 390 px and read-only for a manager', async () => {
    const page = await signedIn(DEMO.manager, studyUrl, 390)
    expect(await page.getByRole('button', { name: 'Save revision' }).count()).toBe(0)
    expect(await field(page, 'Reference voltage').getAttribute('readonly')).not.toBeNull()
    await page.screenshot({ path: `${SHOTS}/study-manager-390.png`, fullPage: true })
    await expectAccessible(page)
    await page.context().close()
    const narrow = await signedIn(DEMO.engineer, studyUrl, 390)
    await narrow.screenshot({ path: `${SHOTS}/study-engineer-390.png`, fullPage: true })
    await narrow.context().close()
  })

  it('lists the demo presets as demo data on Processes and lets an architect add one', async () => {
    const page = await signedIn(DEMO.architect, '/processes')
    expect(await page.getByTestId('demo-badge').count()).toBeGreaterThanOrEqual(3)
    await page.getByTestId('new-preset').click()
    await page.getByLabel('Name', { exact: true }).fill(`Journey preset ${Date.now()}`)
    await field(page, 'Sheet resistance').fill('2 V')
    await field(page, 'Matching coefficient').click()
    await expect.poll(() => page.getByTestId('preset-form').textContent()).toContain('must be a sheet resistance')
    await page.screenshot({ path: `${SHOTS}/processes-form-1280.png`, fullPage: true })
    await expectAccessible(page)
    await field(page, 'Sheet resistance').fill('450 Ω/□')
    await field(page, 'Matching coefficient').fill('1 %·µm')
    await page.getByRole('button', { name: 'Add preset' }).click()
    await expect.poll(() => page.getByTestId('preset-error').textContent()).toContain('1 field needs a valid value')
    await field(page, 'Matching convention').selectOption('pair')
    await page.getByRole('button', { name: 'Add preset' }).click()
    await expect.poll(() => page.getByTestId('preset-notice').textContent()).toContain('Saved')
    await page.context().close()
    const narrow = await signedIn(DEMO.engineer, '/processes', 390)
    expect(await narrow.getByTestId('new-preset').count()).toBe(0)
    await narrow.screenshot({ path: `${SHOTS}/processes-390.png`, fullPage: true })
    await narrow.context().close()
  })
})
