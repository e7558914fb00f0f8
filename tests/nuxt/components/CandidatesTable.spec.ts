import { mountSuspended } from '@nuxt/test-utils/runtime'
import { beforeAll, describe, expect, it } from 'vitest'
import CandidatesTable from '../../../components/candidates/CandidatesTable.vue'
import { engineOutput, SPEC } from './fixtures'

type Out = Awaited<ReturnType<typeof engineOutput>>['out']
let props: { candidates: Out['candidates'], spec: Record<string, unknown>, ranking: Out['ranking']['candidates'], findings: Out['findings'], recommendedId: string | null, hues: Record<string, string>, selectedId: string | null }
let areaOrder: string[]
let areaOf: Map<string, number>
beforeAll(async () => {
  const { out } = await engineOutput()
  props = { candidates: out.candidates, spec: SPEC, ranking: out.ranking.candidates, findings: out.findings, recommendedId: out.recommendation.candidateId, hues: {}, selectedId: null }
  // smallest area first = largest headroom under the budget (derived from the engine's metrics)
  areaOf = new Map(out.candidates.map(c => [c.id, c.metrics.totalAreaMm2!]))
  areaOrder = [...out.candidates].sort((a, b) => a.metrics.totalAreaMm2! - b.metrics.totalAreaMm2!).map(c => c.id)
})

const rowIds = (w: { findAll: (s: string) => { attributes: (n: string) => string | undefined }[] }) => w.findAll('tbody tr').map(r => r.attributes('data-candidate'))

describe('CandidatesTable', () => {
  it('lists every candidate, ranked first, with the recommended one outlined in copper', async () => {
    const w = await mountSuspended(CandidatesTable, { props })
    expect(rowIds(w)).toEqual(props.ranking.map(r => r.candidateId))
    const rec = w.get('tr[data-recommended]')
    expect(rec.attributes('data-candidate')).toBe(props.recommendedId)
    expect(rec.classes()).toContain('outline-copper')
    expect(rec.text()).toContain('recommended')
  })

  it('shows each spec line the engine fails with ✕ and the word, and a met one with ✓', async () => {
    const w = await mountSuspended(CandidatesTable, { props })
    for (const c of props.candidates) {
      const area = w.get(`tr[data-candidate="${c.id}"] [data-line="area"]`)
      const over = c.metrics.totalAreaMm2! > SPEC.areaBudgetMm2
      expect(area.attributes('data-state') === 'fail').toBe(over)
      expect(area.text()).toContain(over ? '✕fails' : 'mm²')
      if (!over) expect(area.text()).toMatch(/✓meets|▲risk/)
    }
  })

  it('sorts by a spec line\'s margin, largest headroom first, and says so to assistive technology', async () => {
    const w = await mountSuspended(CandidatesTable, { props })
    await w.get('button[data-sort="area"]').trigger('click')
    const areas = () => rowIds(w).map(id => areaOf.get(id!))
    // ties (equal areas) may come in either order; the sequence of areas may not
    expect(areas()).toEqual(areaOrder.map(id => areaOf.get(id)))
    expect(w.get('button[data-sort="area"]').element.closest('th')!.getAttribute('aria-sort')).toBe('descending')
    await w.get('button[data-sort="area"]').trigger('click')
    expect(areas()).toEqual(areaOrder.map(id => areaOf.get(id)).reverse())
  })

  it('asks for a candidate\'s findings', async () => {
    const w = await mountSuspended(CandidatesTable, { props })
    await w.get(`tr[data-candidate="${areaOrder[0]}"] button[aria-pressed]`).trigger('click')
    expect(w.emitted('select')).toEqual([[areaOrder[0]]])
  })
})
