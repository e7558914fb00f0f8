import { mkdirSync } from 'node:fs'
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { launchBrowser, newContext } from '../support/browser'
import { DEMO, DEMO_PASSWORD } from '../support/http'

const SHOTS = 'tests/e2e/screenshots'
let browser: Browser
let close: () => Promise<void>
beforeAll(async () => {
  ({ browser, close } = await launchBrowser())
  mkdirSync(SHOTS, { recursive: true })
})
afterAll(async () => {
  await close()
})

describe('portfolio', () => {
  for (const width of [1280, 390]) {
    it(`lets a program manager sort the team's studies and export them (${width} px)`, async () => {
      const context = await newContext(browser, inject('baseUrl'), width)
      const page = await context.newPage()
      await page.goto('/sign-in?redirect=/portfolio')
      await page.locator('form[data-ready]').waitFor({ timeout: 60_000 })
      await page.getByLabel('Email').fill(DEMO.manager)
      await page.getByLabel('Password').fill(DEMO_PASSWORD)
      await page.getByRole('button', { name: 'Sign in' }).click()
      await page.waitForURL(/\/portfolio$/)
      await page.getByTestId('portfolio-table').waitFor()
      await page.getByRole('button', { name: 'Study' }).click()
      await page.waitForURL(/sort=title/)
      await expect.poll(() => page.locator('th[aria-sort="descending"]').textContent()).toContain('Study')
      const titles = await page.locator('[data-testid="portfolio-table"] tbody tr td:first-child a').allTextContents()
      expect(titles.length).toBeGreaterThan(0)
      expect([...titles].sort((a, b) => b.localeCompare(a, undefined, { sensitivity: 'base' }))).toEqual(titles)
      expect(await page.getByTestId('portfolio-csv').getAttribute('href')).toContain('sort=title')
      await page.screenshot({ path: `${SHOTS}/portfolio-${width}.png`, fullPage: true })
      await context.close()
    })
  }
})
