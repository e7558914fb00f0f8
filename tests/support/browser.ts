import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import { chromium, type Browser, type BrowserContext } from 'playwright-core'

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
