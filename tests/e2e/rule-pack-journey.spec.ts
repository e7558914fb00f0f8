import type { Browser } from 'playwright-core'
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

describe('admin adds a team rule, dry-runs it and sees it fire', () => {
  it('writes a rule with the form, sees it fire on the sample study, saves it enabled and sees it fire on a study and in evaluations', async () => {
    const context = await newContext(browser, baseUrl())
    const page = await context.newPage()
    await page.goto('/sign-in')
    await page.locator('form[data-ready]').waitFor({ timeout: 60_000 })
    await page.getByLabel('Email').fill(DEMO.admin)
    await page.getByLabel('Password').fill(DEMO_PASSWORD)
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(/\/studies$/)
    await page.getByRole('link', { name: 'Rule packs' }).click()
    await page.waitForURL(/\/rule-packs$/)
    await page.getByTestId('new-rule-pack').click()
    await page.waitForURL(/\/rule-packs\/new$/)

    const packId = `journey-${Date.now()}`
    await page.getByTestId('pack-id').fill(packId)
    await page.getByTestId('pack-id').blur()
    const form = page.getByTestId('rule-form')
    await form.getByLabel('Rule id').fill('switches-over-team-limit')
    await form.getByLabel('Severity').selectOption('warn')
    await form.getByLabel('Title').fill('More switches than our layout allows')
    await form.getByLabel('Field').selectOption('switchCount')
    await form.getByLabel('Comparison').selectOption('greaterThan')
    await form.getByLabel('Value (SI units').fill('100')
    await form.getByLabel('Explanation').fill('{metrics.switchCount|int} switches, over our line of 100.')
    await form.getByRole('button', { name: 'Add this rule to the pack' }).click()
    // The rule in the interface's words: its severity word and the condition read as a sentence.
    const listed = page.getByTestId('pack-rules').locator('[data-rule="switches-over-team-limit"]')
    await expect.poll(() => listed.textContent()).toContain('Risk')
    expect(await listed.textContent()).toContain('When Result: switches is above 100')
    await page.screenshot({ path: `${ARTIFACTS}/rule-pack-editor.png`, fullPage: true })
    await page.getByTestId('pack-stored').locator('summary').click()
    await expect.poll(() => page.getByTestId('pack-json').inputValue()).toContain('switches-over-team-limit')
    await expect.poll(() => page.getByTestId('pack-valid').textContent()).toContain('2 rules')

    // A broken edit names the rule and the field, live.
    const good = await page.getByTestId('pack-json').inputValue()
    await page.getByTestId('pack-json').fill(good.replace('"$.switchCount"', '"$.switches"'))
    await expect.poll(() => page.getByTestId('pack-problems').textContent()).toContain('rule "switches-over-team-limit"')
    await page.screenshot({ path: `${ARTIFACTS}/rule-pack-invalid.png`, fullPage: true })
    await page.getByTestId('pack-json').fill(good)

    await page.getByRole('button', { name: 'Dry run on the sample study' }).click()
    const fired = page.getByTestId('dry-run-result').locator('[data-rule="switches-over-team-limit"]').first()
    // the sample's 10-bit strings have 1024 and 2046 switches, segmented m = 7…9 more than 100
    await expect.poll(() => fired.textContent()).toContain('fires on')
    expect(await fired.textContent()).toContain('String, direct decode')
    expect(await fired.textContent()).toContain('More switches than our layout allows')
    await page.screenshot({ path: `${ARTIFACTS}/rule-pack-dry-run.png`, fullPage: true })

    await page.getByTestId('pack-enabled').check()
    await page.getByRole('button', { name: 'Save pack' }).click()
    await page.waitForURL(/\/rule-packs\/\d+$/)
    await expect.poll(() => page.getByTestId('rule-pack-history').textContent()).toContain('created')

    const res = await page.request.post('/api/evaluate', {
      data: {
        spec: { bits: 10, vrefV: 2.5, updateRateHz: 1e5, loadCapacitanceF: 1e-12, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, glitchLimitVs: 1e-9, powerBudgetW: 1e-2 },
        process: { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' },
        options: { topologies: ['string'], trials: 0 }
      }
    })
    const body = await res.json() as { findings: { packId: string, candidateId: string }[] }
    expect(body.findings.filter(f => f.packId === packId).map(f => f.candidateId).sort()).toEqual(['string-direct', 'string-tree'])
    const id = Number(/\d+$/.exec(page.url())?.[0] ?? 0) || null

    // On a study: the Monte Carlo run on the server applies the team's enabled packs, and the
    // string's findings on the study page carry the team rule (the 10-bit demo study's direct
    // string has 1,024 tap switches, over the rule's 100).
    await page.goto('/studies')
    await page.getByRole('link', { name: 'LED bias DAC, 10 bit' }).click()
    await page.waitForURL(/\/studies\/\d+$/)
    // The live preview runs the team's enabled packs too, so the rule fires before any Monte Carlo run.
    await expect.poll(() => page.getByTestId('live-state').textContent(), { timeout: 30_000 }).toContain('up to date')
    await page.locator('[data-testid="candidates-table"] tr[data-candidate="string-direct"] button[aria-pressed]').click()
    const live = page.getByTestId('findings-list').locator('[data-rule="switches-over-team-limit"]').first()
    await expect.poll(() => live.textContent(), { timeout: 20_000 }).toContain(packId)
    await page.getByTestId('mc-run').click()
    await expect.poll(() => page.getByTestId('mc-status').textContent(), { timeout: 90_000 }).toContain('done for these inputs')
    await page.locator('[data-testid="candidates-table"] tr[data-candidate="string-direct"] button[aria-pressed]').click()
    const onStudy = page.getByTestId('findings-list').locator('[data-rule="switches-over-team-limit"]').first()
    await expect.poll(() => onStudy.textContent(), { timeout: 20_000 }).toContain(packId)
    expect(await onStudy.textContent()).toContain('switches, over our line of 100.')
    await page.screenshot({ path: `${ARTIFACTS}/rule-pack-on-study.png`, fullPage: true })

    await page.goto('/rule-packs')
    await expect.poll(() => page.getByTestId('rule-pack-table').textContent()).toContain(packId)
    await page.screenshot({ path: `${ARTIFACTS}/rule-packs.png`, fullPage: true })
    // leave the demo team as it was
    if (id) await page.request.patch(`/api/rule-packs/${id}`, { data: { version: 1, enabled: false } })
    await context.close()
  }, 240_000)
})
