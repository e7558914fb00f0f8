import { readdirSync, readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { allFormulas, PROCEDURES } from '#shared/core/explain/registry'
import { BUILT_IN_PACKS } from '#shared/findings/registry'
import { citedSections, HANDBOOK, handbookAnchor, handbookSection } from '#shared/handbook/index'

const rulesDir = new URL('../../../rules/', import.meta.url)

/** Every "§n" the product cites: rule packs on disk, the built-in packs as loaded, formulas and procedures. */
function citations(): { where: string, citation: string }[] {
  const out: { where: string, citation: string }[] = []
  for (const file of readdirSync(rulesDir).filter(f => f.endsWith('.json'))) {
    const pack = JSON.parse(readFileSync(new URL(file, rulesDir), 'utf8')) as { rules: { id: string, basis: { handbook: string[] } }[] }
    for (const r of pack.rules) for (const h of r.basis.handbook) out.push({ where: `rules/${file} ${r.id}`, citation: h })
  }
  for (const p of BUILT_IN_PACKS) for (const r of p.rules) for (const h of r.basis.handbook) out.push({ where: `pack ${p.id} ${r.id}`, citation: h })
  for (const f of allFormulas()) out.push({ where: `formula ${f.spec.id}`, citation: f.spec.reference.section })
  for (const p of Object.values(PROCEDURES)) out.push({ where: `procedure ${p.id}`, citation: p.reference.section })
  return out
}

describe('handbook', () => {
  it('has every section that rules, formulas and procedures cite', () => {
    const all = citations()
    // derived: 13+ rules and dozens of formulas cite sections; an empty list would make this test vacuous
    expect(all.length).toBeGreaterThan(50)
    const missing = all.flatMap(c => citedSections(c.citation).length === 0
      ? [`${c.where}: "${c.citation}" names no section`]
      : citedSections(c.citation).filter(id => !handbookSection(id)).map(id => `${c.where}: §${id}`))
    expect(missing).toEqual([])
  })

  it('reads citations the way they are written', () => {
    expect(citedSections('§4.3 item 1')).toEqual(['4.3'])
    expect(citedSections('§4.6, §6')).toEqual(['4.6', '6'])
    expect(handbookAnchor('4.3')).toBe('section-4-3')
  })

  it('numbers its sections once each, in order, each with text and named sources', () => {
    const ids = HANDBOOK.map(s => s.id)
    expect(new Set(ids).size).toBe(ids.length)
    const key = (id: string) => id.split('.').map(Number).reduce((a, n, i) => a + n * 100 ** (2 - i), 0)
    expect([...ids].sort((a, b) => key(a) - key(b))).toEqual(ids)
    for (const s of HANDBOOK) {
      expect(s.body.length).toBeGreaterThan(0)
      expect(s.sources.length).toBeGreaterThan(0)
    }
  })
})
