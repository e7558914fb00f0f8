import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { expectAccessible, launchBrowser, signedInPage } from '../support/browser'
import { DEMO } from '../support/http'

const SHOTS = join(process.cwd(), 'tests/e2e/screenshots')
const HEADER = 'title,blockName,bits,vrefV,updateRateHz,loadCapacitanceF,inlTargetLsb,dnlTargetLsb,yieldTarget,areaBudgetMm2,glitchLimitVs,powerBudgetW,sheetOhmPerSq,matchingPctUm,matchingConvention,topologies,trials'
const row = (title: string, vref: string) => `${title},IO-FAM,3,${vref},1 MS/s,1 pF,0.5 LSB,0.5,99 %,0.05 mm²,100 pV·s,1 mW,1 kΩ/□,1 %·µm,pair,r2r-voltage,0`
// the hand-worked example of tests/unit/shared/io/benchCsv.spec.ts: end-point INL from −0.2 to 0.2 LSB (IEEE Std 1658 definitions, MODELS.md §1)
const BENCH = '# bench run, invented\ncode,voltage\n0,0\n1,1\n2,2.1\n3,2.9\n4,4.2\n5,5\n6,5.8\n7,7\n'

let browser: Browser
let close: () => Promise<void>
beforeAll(async () => {
  ({ browser, close } = await launchBrowser())
  mkdirSync(SHOTS, { recursive: true })
})
afterAll(async () => {
  await close()
})

describe('in and out', () => {
  for (const width of [1280, 390]) {
    it(`imports specs from a CSV with a bad row, fixed, then compares bench data on a study (${width} px)`, async () => {
      const page = await signedInPage(browser, inject('baseUrl'), DEMO.engineer, '/studies', width)
      await page.getByTestId('import-studies').click()
      await page.waitForURL(/\/studies\/import$/)
      const stamp = `${width}-${Date.now()}`
      await page.getByTestId('import-text').fill(`${HEADER}\n${row(`IO one ${stamp}`, '1.2 V')}\n${row(`IO two ${stamp}`, '90 V')}\n`)
      await page.getByTestId('import-check').click()
      await expect.poll(() => page.getByTestId('import-issues-3').textContent()).toContain('Line 3, Reference voltage (column vrefV): must be from 100 mV to 50 V (got 90 V)')
      expect(await page.getByTestId('import-verdict').textContent()).toContain('1 of 2 rows have problems')
      expect(await page.getByTestId('import-create').isDisabled()).toBe(true)
      await expectAccessible(page)
      await page.screenshot({ path: `${SHOTS}/import-errors-${width}.png`, fullPage: true })

      await page.getByTestId('import-text').fill(`${HEADER}\n${row(`IO one ${stamp}`, '1.2 V')}\n${row(`IO two ${stamp}`, '7 V')}\n`)
      await page.getByTestId('import-check').click()
      await expect.poll(() => page.getByTestId('import-verdict').textContent()).toContain('2 rows are ready')
      await page.getByTestId('import-create').click()
      await page.getByTestId('import-created').waitFor()
      await page.getByRole('link', { name: `IO one ${stamp}` }).click()
      await page.waitForURL(/\/studies\/\d+$/)
      await page.getByTestId('study-io').waitFor()
      // the candidates come from the live comparison (the imported revision has inputs only)
      await page.locator('#bench-candidate option').first().waitFor({ state: 'attached', timeout: 60_000 })
      await page.getByTestId('bench-file').setInputFiles({ name: 'bench-run-1.csv', mimeType: 'text/csv', buffer: Buffer.from(BENCH) })
      await page.getByTestId('bench-upload').click()
      await page.getByTestId('bench-result').waitFor()
      expect(await page.getByTestId('bench-inl-End-point').textContent()).toContain('-0.2 … 0.2 LSB')
      expect(await page.getByTestId('bench-list').textContent()).toContain('bench-run-1.csv')
      await page.getByTestId('study-io').scrollIntoViewIfNeeded()
      await expectAccessible(page)
      await page.screenshot({ path: `${SHOTS}/study-io-${width}.png`, fullPage: true })
      await page.getByTestId('study-io').screenshot({ path: `${SHOTS}/study-io-area-${width}.png` })
      await page.context().close()
    })
  }
})
