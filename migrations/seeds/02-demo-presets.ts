import type { Knex } from 'knex'
import { DEMO_TEAM } from './01-demo-team'

/** Invented process presets for the demo only: not taken from any foundry's data. */
const PRESETS = [
  {
    name: 'Demo 180 nm — silicide-blocked poly',
    description: 'Demo data, invented for the walkthrough. Replace with your PDK values.',
    sheet_ohm_per_sq: 300, matching_pct_um: 0.8, matching_convention: 'pair', unit_ohm: 5000,
    switch_ohm: 80, switch_skew_s: 80e-12, switch_charge_c: 2e-15, switch_area_um2: 6,
    gate_area_um2: 3, layout_overhead: 2, min_width_um: 0.6, min_length_um: 1.2
  },
  {
    name: 'Demo 130 nm — high-resistivity poly',
    description: 'Demo data, invented for the walkthrough. Replace with your PDK values.',
    sheet_ohm_per_sq: 1000, matching_pct_um: 1.5, matching_convention: 'pair', unit_ohm: 20000,
    switch_ohm: 120, switch_skew_s: 100e-12, switch_charge_c: 1e-15, switch_area_um2: 4,
    gate_area_um2: 2, layout_overhead: 2.2, min_width_um: 0.4, min_length_um: 1
  },
  {
    name: 'Demo 65 nm — diffusion resistor',
    description: 'Demo data, invented for the walkthrough. Replace with your PDK values.',
    sheet_ohm_per_sq: 150, matching_pct_um: 0.5, matching_convention: 'single', unit_ohm: 2000,
    switch_ohm: 40, switch_skew_s: 40e-12, switch_charge_c: 0.5e-15, switch_area_um2: 1.5,
    gate_area_um2: 0.8, layout_overhead: 2.5, min_width_um: 0.2, min_length_um: 0.5
  }
]

export async function seed(knex: Knex): Promise<void> {
  const team = await knex('teams').where({ slug: DEMO_TEAM.slug }).first('id')
  const rows = PRESETS.map(p => ({ ...p, team_id: team.id, is_demo: true }))
  await knex('process_presets').insert(rows).onConflict(['team_id', 'name']).merge()
}
