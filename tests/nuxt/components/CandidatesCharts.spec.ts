import { mountSuspended } from '@nuxt/test-utils/runtime'
import { beforeAll, describe, expect, it } from 'vitest'
import CandidatesCharts from '../../../components/candidates/CandidatesCharts.vue'
import { candidateLabel } from '../../../utils/candidateLabel'
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

describe('per-code and yield charts from the engine output', () => {
  const typed = { apexchart: { props: ['series', 'options', 'type'], template: '<div class="chart-stub" :data-series="series.length" :data-types="series.map(s => s.type).join(\',\')" />' } }
  const mountTyped = () => mountSuspended(CandidatesCharts, { props, global: { stubs: typed } })
  const shown = () => props.candidates.filter(c => props.order.slice(0, 5).includes(c.id) || c.id === props.recommendedId)
  const m = (c: Out['candidates'][number], k: string) => (c.metrics as Record<string, unknown>)[k] as number

  it('DNL: the nominal band\'s extremes are the engine\'s systematic DNL, and a 200-trial run adds an envelope of 32 sampled circuits per candidate', async () => {
    const w = await mountTyped()
    const rows = w.findAll('[data-testid="chart-dnl"] tbody tr')
    expect(rows).toHaveLength(shown().length)
    for (const c of shown()) {
      const row = rows.find(r => r.get('th').text() === candidateLabel(c))!
      const cells = row.findAll('td').map(td => td.text())
      // derived: |DNL| max over all codes is what the engine reports as systematicDnlLsb
      const worst = Math.max(Math.abs(Number(cells[0])), Math.abs(Number(cells[2])))
      expect(worst).toBeCloseTo(m(c, 'systematicDnlLsb'), 3)
      expect(cells[6]).toBe('32')
      expect(Number(cells[4])).toBeLessThan(Number(cells[5]))
    }
    // one envelope band and one nominal band per candidate
    expect(w.get('[data-testid="chart-dnl"] .chart-stub').attributes('data-series')).toBe(String(2 * shown().length))
  })

  it('transfer error / INL: switches quantity and shows the engine\'s nominal INL extremes', async () => {
    const w = await mountTyped()
    const c = shown()[0]!
    const inlCells = () => w.findAll('[data-testid="chart-transfer"] tbody tr').find(r => r.get('th').text() === candidateLabel(c))!.findAll('td').map(td => Number(td.text()))
    const inl = inlCells()
    expect(Math.max(Math.abs(inl[0]!), Math.abs(inl[2]!))).toBeCloseTo(m(c, 'systematicInlLsb'), 3)
    await w.get('[data-testid="transfer-quantity"]').setValue('transferErrorLsb')
    expect(w.get('[data-testid="chart-transfer"] caption').text()).toContain('transfer error')
    expect(w.get('[data-testid="chart-transfer"] figcaption').text()).toContain('ideal k·LSB')
  })

  it('yield against area: the engine\'s fast-yield curve (its value at the drawn unit is the fast yield) with the Monte Carlo yield as a dot', async () => {
    const w = await mountTyped()
    expect(w.get('[data-testid="chart-yield-summary"]').text()).toContain('Fast yields of the engine')
    const types = w.get('[data-testid="chart-yield"] .chart-stub').attributes('data-types')!.split(',')
    expect(types.filter(t => t === 'line')).toHaveLength(shown().length)
    expect(types.filter(t => t === 'scatter')).toHaveLength(shown().length)
    for (const c of shown()) {
      const cells = w.findAll('[data-testid="chart-yield"] tbody tr').find(r => r.get('th').text() === candidateLabel(c))!.findAll('td').map(td => td.text())
      // the engine's fast yield of every criterion together (the sizing sample's pass fraction)
      expect(Number(cells[1]!.replace(' %', ''))).toBeCloseTo(m(c, 'yieldAnalytic') * 100, 4)
      expect(Number(cells[2]!.replace(' %', ''))).toBeCloseTo(m(c, 'yield') * 100, 2)
    }
  })
})
