import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import HandbookPage from '../../../pages/handbook.vue'
import HandbookRef from '../../../components/handbook/HandbookRef.vue'
import { BUILT_IN_PACKS } from '../../../shared/findings/registry'
import { allFormulas } from '../../../shared/core/explain/registry'
import { citedSections } from '../../../shared/handbook/index'

describe('handbook page', () => {
  it('has an anchor for every section a built-in rule or a formula cites, and a contents link to each', async () => {
    const w = await mountSuspended(HandbookPage)
    const cited = new Set([
      ...BUILT_IN_PACKS.flatMap(p => p.rules.flatMap(r => r.basis.handbook.flatMap(citedSections))),
      ...allFormulas().flatMap(f => citedSections(f.spec.reference.section))
    ])
    expect(cited.size).toBeGreaterThan(10)
    for (const id of cited) {
      const anchor = `section-${id.replace(/\./g, '-')}`
      expect(w.find(`section#${anchor}`).exists(), `§${id}`).toBe(true)
      expect(w.find(`nav a[href="#${anchor}"]`).exists(), `contents link to §${id}`).toBe(true)
    }
    expect(w.get('#section-4-3 h3').text()).toContain('§4.3')
    expect(w.get('#section-10').text()).toContain('Caution')
  })
})

describe('HandbookRef', () => {
  it('links each cited section to its anchor on the handbook page and keeps the rest of the citation', async () => {
    const w = await mountSuspended(HandbookRef, { props: { citation: '§4.6, §6', prefix: 'handbook' } })
    expect(w.findAll('a').map(a => a.attributes('href'))).toEqual(['/handbook#section-4-6', '/handbook#section-6'])
    expect(w.text()).toBe('handbook §4.6, §6')
    const item = await mountSuspended(HandbookRef, { props: { citation: '§4.3 item 1' } })
    expect(item.get('a').attributes('href')).toBe('/handbook#section-4-3')
    expect(item.text()).toContain('item 1')
  })
})
