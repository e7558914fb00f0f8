import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import ExplainLink from '../../../components/explain/ExplainLink.vue'
import ExplainMetric from '../../../components/explain/ExplainMetric.vue'
import FindingsList from '../../../components/findings/FindingsList.vue'
import { evaluateSpec, parseEvaluateInput } from '../../../shared/core/evaluate'
import { explainCandidate } from '../../../shared/core/explain/candidate'
import { formatSi } from '../../../shared/utils/format'

// The engine is the reference here ("derived"): the view must show what explainCandidate recorded.
const input = parseEvaluateInput({
  spec: {
    bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5,
    yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, refSourceOhm: 0, powerBudgetW: 1e-3
  },
  process: {
    sheetOhmPerSq: 1000, matchingPctUm: 1.0, matchingConvention: 'single', unitOhm: 10000, switchOhm: 0, switchSkewS: 1e-10,
    switchChargeC: 1e-15, switchAreaUm2: 4, gateAreaUm2: 2, layoutOverhead: 2, minWidthUm: 0.4, minLengthUm: 1
  },
  options: { topologies: ['string'], trials: 0, seed: 1, inlDefinition: 'endpoint' }
})
const candidate = evaluateSpec(input).candidates.find(c => c.id === 'string-direct')!
const trace = explainCandidate(input, candidate)

describe('ExplainMetric', () => {
  it('is a closed disclosure that opens from the keyboard-reachable button', async () => {
    const wrapper = await mountSuspended(ExplainMetric, { props: { metric: 'settlingS', trace } })
    const toggle = wrapper.get('[data-testid="explain-toggle"]')
    expect(toggle.element.tagName).toBe('BUTTON')
    expect(toggle.attributes('aria-expanded')).toBe('false')
    await toggle.trigger('click')
    expect(toggle.attributes('aria-expanded')).toBe('true')
    expect(wrapper.get('[data-testid="explain-panel"]').attributes('id')).toBe(toggle.attributes('aria-controls'))
  })

  it('shows the readable formula, the inputs in engineering notation, the substituted numbers and the handbook label', async () => {
    const wrapper = await mountSuspended(ExplainMetric, { props: { metric: 'tauS', trace, open: true } })
    expect(wrapper.get('[data-testid="explain-formula"]').text()).toBe('τ = R_out,eff · C_L')
    expect(wrapper.get('[data-input="C_L"]').text()).toContain('1 pF')
    expect(wrapper.get('[data-testid="explain-substituted"]').text()).toContain(`= ${formatSi(candidate.metrics.tauS, 's', 4)}`)
    expect(wrapper.get('[data-testid="explain-reference"]').text()).toContain('§6 · common practice')
  })

  it('names a metric by its label and gives a procedure\'s result its unit, never the contract name alone', async () => {
    const key = (['refSourceMaxOhm', 'routMaxOhm', 'systematicInlLsb'] as const).find(k => trace[k]?.kind === 'procedure' && typeof trace[k]?.result === 'number')!
    const wrapper = await mountSuspended(ExplainMetric, { props: { metric: key, trace, open: true } })
    expect(wrapper.get('[data-testid="explain-toggle"]').text()).not.toContain(key)
    expect(wrapper.get('[data-testid="explain-toggle"]').text()).toMatch(/^[▸▾]?\s*How was the [a-z]/)
    // The unit follows from the contract name's SI suffix (DEVELOPERS.md: SI units in names).
    expect(wrapper.get('[data-testid="explain-result"]').text()).toMatch(/(Ω|LSB)$/)
  })

  it('opens the step an input came from inside the explanation', async () => {
    const wrapper = await mountSuspended(ExplainMetric, { props: { metric: 'settlingS', trace, open: true } })
    await wrapper.get('[data-input="tau"] button').trigger('click')
    expect(wrapper.find('[data-explain="tauS"]').exists()).toBe(true)
  })
})

describe('ExplainLink', () => {
  it('links a metric name to its explanation, and stays plain text without one', async () => {
    const linked = await mountSuspended(ExplainLink, { props: { metric: 'noiseVrms', trace } })
    await linked.get('[data-testid="explain-link"]').trigger('click')
    expect(linked.find('[data-explain="noiseVrms"]').exists()).toBe(true)
    const plain = await mountSuspended(ExplainLink, { props: { metric: 'noiseVrms', trace: null } })
    expect(plain.find('[data-testid="explain-link"]').exists()).toBe(false)
    expect(plain.get('[data-metric]').text()).toBe('output noise')
  })
})

describe('FindingsList with explanations', () => {
  const finding = {
    ruleId: 'demo-rule', packId: 'demo', packVersion: 1, severity: 'warn' as const, candidateId: candidate.id,
    title: 'Slow settling', explanation: 'Settles late.', action: 'Lower R.',
    basis: { handbook: ['§6'], metrics: ['settlingS', 'notAMetric'], thresholdSource: 'spec', thresholdNote: 'the update rate' }
  }

  it('turns the basis metrics of a finding into links to their explanations', async () => {
    const wrapper = await mountSuspended(FindingsList, { props: { findings: [finding], explanations: { [candidate.id]: trace } } })
    const links = wrapper.findAll('[data-testid="explain-link"]')
    expect(links.map(l => l.text())).toEqual(['settling time'])
    await links[0]!.trigger('click')
    expect(wrapper.find('[data-explain="settlingS"] [data-testid="explain-formula"]').text()).toBe('t_s = τ · ((N + 1) · ln(2))')
    expect(wrapper.findAll('[data-metric]').map(c => c.text())).toEqual(['settling time', 'notAMetric'])
  })
})
