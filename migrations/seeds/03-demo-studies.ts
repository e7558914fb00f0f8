import type { Knex } from 'knex'
import { DEMO_TEAM } from './01-demo-team'

/** Invented demo studies with placeholder specs (every engine contract spec field, SI units). */
export const STUDIES = [
  {
    title: 'Bridge-sensor trim DAC, 12 bit',
    block_name: 'Sensor front end — offset trim',
    owner: 'architect@harrowlake.example',
    spec: { bits: 12, vrefV: 2.5, updateRateHz: 100e3, loadCapacitanceF: 10e-12, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 50e-12, refSourceOhm: 0, powerBudgetW: 1e-3 }
  },
  {
    title: 'Valve positioner set-point DAC, 16 bit',
    block_name: 'Actuator loop — set point',
    owner: 'architect@harrowlake.example',
    spec: { bits: 16, vrefV: 4.096, updateRateHz: 10e3, loadCapacitanceF: 20e-12, loadResistanceOhm: 1e6, inlTargetLsb: 2, dnlTargetLsb: 0.9, yieldTarget: 0.99, monotonicRequired: true, areaBudgetMm2: 0.4, glitchLimitVs: 2e-9, refSourceOhm: 2, powerBudgetW: 5e-3 }
  },
  {
    title: 'LED bias DAC, 10 bit',
    block_name: 'Optical channel — LED current',
    owner: 'engineer@harrowlake.example',
    spec: { bits: 10, vrefV: 1.2, updateRateHz: 1e6, loadCapacitanceF: 5e-12, loadResistanceOhm: null, inlTargetLsb: 1, dnlTargetLsb: 0.5, yieldTarget: 0.99, monotonicRequired: true, areaBudgetMm2: 0.02, glitchLimitVs: 20e-12, refSourceOhm: 0, powerBudgetW: 2e-3 }
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
