import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { ARTIFACTS, expectAccessible, launchBrowser, signedInPage } from '../support/browser'
import { DEMO } from '../support/http'

let browser: Browser
let close: () => Promise<void>
const baseUrl = () => inject('baseUrl')

beforeAll(async () => {
  ({ browser, close } = await launchBrowser())
})
afterAll(async () => {
  await close()
})

/** No sideways scrolling of the page itself (issue 14's phone check; tables may scroll in their own region). */
async function pageFitsWidth(page: Page): Promise<boolean> {
  return page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth + 1)
}

// Screenshots for review at a desktop and a phone width (issue 12 item 7, issue 14: 1280 and 390 px).
describe.each([1280, 390])('handbook and rule-pack editor at %i px', (width) => {
  it('the handbook explains the switch compensations and the string glitch, and fits the width', async () => {
    const page = await signedInPage(browser, baseUrl(), DEMO.admin, '/handbook', width)
    await page.locator('#section-4-7').waitFor()
    expect(await page.locator('#section-4-7').textContent()).toContain('2R − R_on')
    expect(await page.locator('#section-4-8').textContent()).toContain('−1 LSB')
    expect(await page.locator('#section-5').textContent()).toContain('tens of nV·s')
    expect(await pageFitsWidth(page)).toBe(true)
    await page.locator('#section-4-7').scrollIntoViewIfNeeded()
    await page.screenshot({ path: `${ARTIFACTS}/handbook-switches-${width}.png` })
    await page.locator('#section-5').scrollIntoViewIfNeeded()
    await page.screenshot({ path: `${ARTIFACTS}/handbook-glitch-${width}.png` })
    await page.context().close()
  })

  it('the rule-pack editor shows rules in the interface\'s words, the stored JSON folded', async () => {
    const page = await signedInPage(browser, baseUrl(), DEMO.admin, '/rule-packs/new', width)
    const listed = page.getByTestId('pack-rules')
    await listed.waitFor()
    expect(await listed.textContent()).toContain('When Result: total area is above 0.01 mm²')
    expect(await listed.textContent()).toContain('Risk')
    expect(await listed.textContent()).not.toContain('greaterThan')
    expect(await page.getByTestId('pack-json').isVisible()).toBe(false)
    expect(await pageFitsWidth(page)).toBe(true)
    await expectAccessible(page)
    await page.screenshot({ path: `${ARTIFACTS}/rule-pack-editor-${width}.png`, fullPage: true })
    await page.getByTestId('pack-stored').locator('summary').click()
    await page.screenshot({ path: `${ARTIFACTS}/rule-pack-editor-json-${width}.png`, fullPage: true })
    await page.context().close()
  })
})
