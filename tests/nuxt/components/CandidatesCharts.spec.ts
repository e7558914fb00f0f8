import { mountSuspended } from '@nuxt/test-utils/runtime'
import { beforeAll, describe, expect, it } from 'vitest'
import CandidatesCharts from '../../../components/candidates/CandidatesCharts.vue'
import { candidateHues } from '../../../utils/chartPalette'
import { engineOutput, SPEC } from './fixtures'

type Out = Awaited<ReturnType<typeof engineOutput>>['out']
let props: { candidates: Out['candidates'], spec: Record<string, unknown>, hues: Record<string, string>, order: string[], recommendedId: string | null }
beforeAll(async () => {
  const { out } = await engineOutput(200)
  const ids = out.candidates.map(c => c.id)
  props = { candidates: out.candidates, spec: SPEC, hues: candidateHues(ids), order: out.ranking.candidates.map(r => r.candidateId), recommendedId: out.recommendation.candidateId }
})
// Charts are stubbed: apexcharts needs a real layout engine; what is tested is what we hand it and the text beside it.
const mount = () => mountSuspended(CandidatesCharts, { props, global: { stubs: { apexchart: { props: ['series', 'options', 'type'], template: '<div class="chart-stub" :data-series="series.length" />' } } } })

describe('CandidatesCharts', () => {
  it('gives every candidate a hue of its own from the palette, the same in every chart', () => {
    const hues = Object.values(props.hues)
    expect(new Set(hues.slice(0, 12)).size).toBe(Math.min(12, hues.length))
  })

  it('draws the best-ranked five at first and toggles a candidate from the legend in every chart', async () => {
    const w = await mount()
    const pressed = () => w.findAll('[data-testid="chart-legend"] button[aria-pressed="true"]').map(b => b.attributes('data-candidate'))
    expect(pressed()).toHaveLength(5)
    const glitchRows = () => w.findAll('[data-testid="chart-glitch"] tbody tr').length
    expect(glitchRows()).toBe(5)
    await w.get(`[data-testid="chart-legend"] button[data-candidate="${pressed()[0]}"]`).trigger('click')
    expect(pressed()).toHaveLength(4)
    expect(glitchRows()).toBe(4)
    expect(w.get('[data-testid="chart-inl"] .chart-stub').attributes('data-series')).toBe('4')
  })

  it('gives each chart a text alternative with the numbers it shows', async () => {
    const w = await mount()
    for (const id of ['chart-inl', 'chart-yield', 'chart-sweep', 'chart-glitch', 'chart-reference']) {
      expect(w.get(`[data-testid="${id}"] table caption`).text().length).toBeGreaterThan(10)
    }
    // The sweep lists every split M = 1 … N − 1 of the 12-bit spec (definition of the sweep).
    expect(w.findAll('[data-testid="chart-sweep"] tbody tr')).toHaveLength(11)
    const worst = props.candidates.find(c => c.id === props.order[0])!
    expect(w.get('[data-testid="chart-glitch"] tbody').text()).toContain(`${worst.metrics.glitchWorstFromCode} → ${worst.metrics.glitchWorstToCode}`)
  })
})
