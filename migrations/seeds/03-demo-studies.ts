import type { Knex } from 'knex'
import { DEMO_TEAM } from './01-demo-team'

/** Invented demo studies with placeholder specs (engine contract field names, SI units). */
const STUDIES = [
  {
    title: 'Bridge-sensor trim DAC, 12 bit',
    block_name: 'Sensor front end — offset trim',
    owner: 'architect@harrowlake.example',
    spec: { bits: 12, vrefV: 2.5, updateRateHz: 100e3, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.997 }
  },
  {
    title: 'Valve positioner set-point DAC, 16 bit',
    block_name: 'Actuator loop — set point',
    owner: 'architect@harrowlake.example',
    spec: { bits: 16, vrefV: 4.096, updateRateHz: 10e3, areaBudgetMm2: 0.4, inlTargetLsb: 2, dnlTargetLsb: 0.9, yieldTarget: 0.99 }
  },
  {
    title: 'LED bias DAC, 10 bit',
    block_name: 'Optical channel — LED current',
    owner: 'engineer@harrowlake.example',
    spec: { bits: 10, vrefV: 1.2, updateRateHz: 1e6, areaBudgetMm2: 0.02, inlTargetLsb: 1, dnlTargetLsb: 0.5, yieldTarget: 0.99 }
  }
]

export async function seed(knex: Knex): Promise<void> {
  const team = await knex('teams').where({ slug: DEMO_TEAM.slug }).first('id')
  for (const study of STUDIES) {
    const owner = await knex('users').where({ email: study.owner }).first('id')
    const row = { team_id: team.id, owner_id: owner.id, title: study.title, block_name: study.block_name, spec: JSON.stringify(study.spec) }
    const existing = await knex('studies').where({ team_id: team.id, title: study.title }).first('id')
    if (existing) {
      await knex('studies').where({ id: existing.id }).update(row)
    } else {
      await knex('studies').insert(row)
    }
  }
}
