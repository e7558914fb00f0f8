import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { expectAccessible, launchBrowser, signedInPage } from '../support/browser'
import { DEMO } from '../support/http'

/**
 * A program manager creates an API token in their settings, sees it once, a script uses it, they
 * revoke it and the script is refused; the API reference lists the routes and filters them.
 * Expectations: README "API tokens" (common practice, no source).
 */
let browser: Browser
let close: () => Promise<void>
beforeAll(async () => {
  ({ browser, close } = await launchBrowser())
})
afterAll(async () => {
  await close()
})

const studies = (token: string) => fetch(`${inject('baseUrl')}/api/studies`, { headers: { authorization: `Bearer ${token}` } }).then(r => r.status)

describe('API tokens and the API reference', () => {
  it('creates a token shown once, which works until it is revoked', async () => {
    const page = await signedInPage(browser, inject('baseUrl'), DEMO.manager, '/settings/tokens')
    await page.getByLabel('Name').fill('Browser journey')
    await page.getByRole('button', { name: 'Create token' }).click()
    const value = (await page.getByTestId('token-value').textContent({ timeout: 30_000 }))!.trim()
    expect(value).toMatch(/^rwt_[\w-]{43}$/)
    expect(await studies(value)).toBe(200)
    const row = page.locator('[data-testid^="token-row-"]', { hasText: 'Browser journey' })
    await expect.poll(() => row.textContent()).toContain('✓ Active')
    await expectAccessible(page)
    page.once('dialog', d => void d.accept())
    await row.getByRole('button', { name: 'Revoke' }).click()
    await expect.poll(() => row.textContent()).toContain('✕ Revoked')
    await expect.poll(() => page.getByTestId('token-fresh').count()).toBe(0)
    expect(await studies(value)).toBe(401)
    expect(await page.content()).not.toContain(value)
    await page.context().close()
  })

  it('lists every route in the API reference and filters them', async () => {
    const page = await signedInPage(browser, inject('baseUrl'), DEMO.engineer, '/api-reference')
    const count = page.getByRole('status').filter({ hasText: 'routes' })
    await expect.poll(async () => Number.parseInt((await count.textContent()) ?? '0')).toBeGreaterThan(60)
    await page.getByLabel('Find a route').fill('tokens')
    await expect.poll(async () => Number.parseInt((await count.textContent()) ?? '0')).toBe(3)
    await expectAccessible(page)
    await page.context().close()
  })
})
