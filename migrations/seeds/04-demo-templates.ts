import type { Knex } from 'knex'
import { DEMO_TEAM } from './01-demo-team'

/** Invented spec templates for the demo only (engine contract spec fields, SI units). */
const TEMPLATES = [
  {
    name: 'Demo — 12-bit sensor trim DAC',
    description: 'Demo data, invented for the walkthrough: a slow, buffered-reference trim DAC.',
    spec: { bits: 12, vrefV: 2.5, updateRateHz: 100e3, loadCapacitanceF: 10e-12, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 50e-12, refSourceOhm: 0, powerBudgetW: 1e-3 }
  },
  {
    name: 'Demo — 10-bit bias DAC',
    description: 'Demo data, invented for the walkthrough: a small, fast bias DAC.',
    spec: { bits: 10, vrefV: 1.2, updateRateHz: 1e6, loadCapacitanceF: 5e-12, loadResistanceOhm: null, inlTargetLsb: 1, dnlTargetLsb: 0.5, yieldTarget: 0.99, monotonicRequired: true, areaBudgetMm2: 0.02, glitchLimitVs: 20e-12, refSourceOhm: 0, powerBudgetW: 0.5e-3 }
  }
]

export async function seed(knex: Knex): Promise<void> {
  const team = await knex('teams').where({ slug: DEMO_TEAM.slug }).first('id')
  const rows = TEMPLATES.map(t => ({ ...t, spec: JSON.stringify(t.spec), team_id: team.id, is_demo: true }))
  await knex('spec_templates').insert(rows).onConflict(['team_id', 'name']).merge(['description', 'spec', 'is_demo'])
}
