import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { launchBrowser, newContext } from '../support/browser'
import { watchCsp } from '../support/csp'
import { DEMO, DEMO_PASSWORD } from '../support/http'

/**
 * The main pages work under the Content-Security-Policy (nonce scripts, no inline script): sign in,
 * the studies list and a study workspace with its charts and the live preview Web Worker, with no
 * policy violation and no console error about one.
 */
const STUDY = 'Bridge-sensor trim DAC, 12 bit'
let browser: Browser
let close: () => Promise<void>

beforeAll(async () => {
  ;({ browser, close } = await launchBrowser())
})
afterAll(async () => {
  await close()
})

describe('content security policy in Chromium', () => {
  it('sign in → studies → study workspace (charts, live preview worker) with zero violations', async () => {
    const context = await newContext(browser, inject('baseUrl'))
    const page = await context.newPage()
    const violations = await watchCsp(page)
    await page.goto('/sign-in?redirect=%2Fstudies')
    await page.locator('form[data-ready]').waitFor({ timeout: 60_000 })
    await page.getByLabel('Email').fill(DEMO.architect)
    await page.getByLabel('Password').fill(DEMO_PASSWORD)
    expect(await violations()).toEqual([])
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(url => url.pathname === '/studies', { waitUntil: 'commit', timeout: 60_000 }).catch(async (error: unknown) => {
      await page.screenshot({ path: 'tests/e2e/screenshots/csp-sign-in-failed.png' })
      throw new Error(`no navigation after sign-in; CSP: ${(await violations()).join('; ')}; ${String(error)}`)
    })
    await page.getByRole('link', { name: STUDY }).waitFor({ timeout: 60_000 })
    expect(await violations()).toEqual([])
    await page.getByRole('link', { name: STUDY }).click()
    await page.waitForURL(/\/studies\/\d+$/)
    // The live preview answers from the Web Worker; the charts draw with apexcharts.
    await expect.poll(async () => {
      const found = await violations()
      return found.length > 0 ? found.join('\n') : await page.getByTestId('live-state').textContent()
    }, { timeout: 60_000 }).toContain('up to date')
    await page.locator('.apexcharts-canvas').first().waitFor({ timeout: 30_000 })
    // The self-hosted Lexend faces loaded (a font-src refusal would leave them unloaded).
    expect(await page.evaluate(async () => {
      await document.fonts.ready
      return [...document.fonts].some(f => f.family.includes('Lexend') && f.status === 'loaded')
    })).toBe(true)
    // A full load of the workspace URL too (server-rendered, then hydrated), not only client navigation.
    await page.reload()
    await expect.poll(() => page.getByTestId('live-state').textContent(), { timeout: 30_000 }).toContain('up to date')
    await page.locator('.apexcharts-canvas').first().waitFor({ timeout: 30_000 })
    expect(await violations()).toEqual([])
    await context.close()
  })
})
