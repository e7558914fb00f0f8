import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { ARTIFACTS, launchBrowser, newContext } from '../support/browser'
import { DEMO, DEMO_PASSWORD } from '../support/http'

let browser: Browser
let close: () => Promise<void>
const baseUrl = () => inject('baseUrl')

beforeAll(async () => {
  ({ browser, close } = await launchBrowser())
})
afterAll(async () => {
  await close()
})

async function signInAs(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.locator('form[data-ready]').waitFor({ timeout: 60_000 })
  await page.getByLabel('Email').fill(email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
}

describe('sign-in → create study → see it in the list', () => {
  it('sends a signed-out visitor to sign-in and back to where they were going', async () => {
    const context = await newContext(browser, baseUrl())
    const page = await context.newPage()
    await page.goto('/studies/new')
    await page.waitForURL(/\/sign-in\?redirect=/)
    await page.screenshot({ path: `${ARTIFACTS}/sign-in.png` })
    await signInAs(page, DEMO.architect)
    await page.waitForURL(/\/studies\/new$/)
    await expect.poll(() => page.getByTestId('current-role').textContent()).toContain('Architect')
    await context.close()
  })

  it('lets an architect create a study and find it in the list', async () => {
    const context = await newContext(browser, baseUrl())
    const page = await context.newPage()
    await page.goto('/sign-in')
    await signInAs(page, DEMO.architect)
    await page.waitForURL(/\/studies$/)
    await page.getByTestId('study-table').waitFor()
    await page.screenshot({ path: `${ARTIFACTS}/studies.png`, fullPage: true })
    await page.getByTestId('new-study').click()
    await page.waitForURL(/\/studies\/new$/)
    const title = `Pressure transmitter zero trim ${Date.now()}`
    await page.getByLabel('Title').fill(title)
    await page.getByLabel('Resolution').fill('14')
    await page.getByRole('button', { name: 'Create study' }).click()
    await page.waitForURL(/\/studies\/\d+$/)
    expect(await page.getByTestId('study-title').textContent()).toContain(title)
    await page.screenshot({ path: `${ARTIFACTS}/study.png`, fullPage: true })
    await page.getByRole('link', { name: 'Studies', exact: true }).click()
    await page.waitForURL(/\/studies$/)
    await expect.poll(() => page.getByTestId('study-table').textContent()).toContain(title)
    await context.close()
  })

  it('shows field errors in place and creates nothing for an invalid form', async () => {
    const context = await newContext(browser, baseUrl())
    const page = await context.newPage()
    await page.goto('/sign-in?redirect=/studies/new')
    await signInAs(page, DEMO.engineer)
    await page.waitForURL(/\/studies\/new$/)
    await page.getByLabel('Resolution').fill('40')
    await page.getByRole('button', { name: 'Create study' }).click()
    await expect.poll(() => page.getByTestId('study-form').textContent()).toContain('Title is required')
    expect(await page.getByTestId('study-form').textContent()).toContain('must be an integer from 2 to 16')
    expect(page.url()).toMatch(/\/studies\/new$/)
    await page.screenshot({ path: `${ARTIFACTS}/study-form-errors.png`, fullPage: true })
    await context.close()
  })

  it('gives a manager a read-only list: no "New study", and the server refuses a forced post', async () => {
    const context = await newContext(browser, baseUrl(), 390)
    const page = await context.newPage()
    await page.goto('/sign-in')
    await signInAs(page, DEMO.manager)
    await page.waitForURL(/\/studies$/)
    await page.getByTestId('study-table').waitFor()
    expect(await page.getByTestId('new-study').count()).toBe(0)
    await page.screenshot({ path: `${ARTIFACTS}/studies-manager-390.png`, fullPage: true })
    await page.goto('/studies/new')
    await page.getByLabel('Title').fill('Not allowed')
    await page.getByRole('button', { name: 'Create study' }).click()
    await expect.poll(() => page.getByTestId('form-error').textContent()).toContain('Your role does not allow this')
    await context.close()
  })

  it('shows one generic message for a wrong password, then signs out cleanly', async () => {
    const context = await newContext(browser, baseUrl())
    const page = await context.newPage()
    await page.goto('/sign-in')
    await signInAs(page, DEMO.admin, 'wrong-password')
    await expect.poll(() => page.getByTestId('sign-in-error').textContent()).toContain('Email or password is incorrect')
    await signInAs(page, DEMO.admin)
    await page.waitForURL(/\/studies$/)
    await page.getByTestId('sign-out').click()
    await page.waitForURL(/\/sign-in/)
    await page.goto('/studies')
    await page.waitForURL(/\/sign-in\?redirect=/)
    await context.close()
  })
})
