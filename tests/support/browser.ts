import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import AxeBuilder from '@axe-core/playwright'
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'
import { expect } from 'vitest'
import { DEMO_PASSWORD } from './http'

export const ARTIFACTS = join(process.cwd(), 'tests/.artifacts')

/**
 * Debian's Chromium, headless, without background network traffic. Playwright gives every launch
 * a fresh temporary profile of its own (it refuses a --user-data-dir argument).
 */
export async function launchBrowser(): Promise<{ browser: Browser, close: () => Promise<void> }> {
  mkdirSync(ARTIFACTS, { recursive: true })
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
      '--disable-background-networking', '--disable-component-update', '--disable-sync']
  })
  return { browser, close: () => browser.close() }
}

/** A fresh context (own cookies) at the test server's address. */
export function newContext(browser: Browser, baseURL: string, width = 1280): Promise<BrowserContext> {
  return browser.newContext({ baseURL, viewport: { width, height: 900 } })
}

/**
 * A fresh context signed in as `email` (demo password), landed on `path` with the app shell drawn.
 * Waits on 'commit', not 'load': on a busy shared machine the load event can lag far behind the page.
 */
export async function signedInPage(browser: Browser, baseURL: string, email: string, path: string, width = 1280): Promise<Page> {
  const context = await newContext(browser, baseURL, width)
  const page = await context.newPage()
  await page.goto(`/sign-in?redirect=${encodeURIComponent(path)}`)
  // Fill only once the form is hydrated: hydration would reset typed values to the empty model.
  await page.locator('form[data-ready]').waitFor({ timeout: 60_000 })
  await page.getByLabel('Email').fill(email)
  await page.getByLabel('Password').fill(DEMO_PASSWORD)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(url => url.pathname === path, { waitUntil: 'commit', timeout: 60_000 })
  // The URL changes before the new page has rendered (its data loads first): wait for the app shell.
  await page.getByTestId('sign-out').waitFor({ timeout: 60_000 })
  await page.locator('main h1').first().waitFor({ timeout: 60_000 })
  return page
}

/** axe-core: no serious or critical violations (WCAG rules as axe ships them). */
export async function expectAccessible(page: Page): Promise<void> {
  const { violations } = await new AxeBuilder({ page }).analyze()
  const bad = violations.filter(v => v.impact === 'serious' || v.impact === 'critical')
  expect(bad.map(v => `${v.id}: ${v.nodes.map(n => n.target.join(' ')).join(', ')}`)).toEqual([])
}
