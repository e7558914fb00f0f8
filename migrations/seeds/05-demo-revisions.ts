import type { Knex } from 'knex'
import { evaluateInputSchema } from '../../shared/core/contract/evaluate'
import { ENGINE_VERSION } from '../../shared/core/version'
import { writeRevision } from '../../server/db/writeRevision'
import { DEMO_TEAM } from './01-demo-team'
import { STUDIES } from './03-demo-studies'

/**
 * A first revision for each demo study that has none: its spec, the first demo process preset and
 * the engine's default options. Inputs only (results null): no results are invented.
 */
export async function seed(knex: Knex): Promise<void> {
  const team = await knex('teams').where({ slug: DEMO_TEAM.slug }).first('id')
  const preset = await knex('process_presets').where({ team_id: team.id, is_demo: true }).orderBy('id').first()
  if (!preset) return
  const process = {
    sheetOhmPerSq: preset.sheet_ohm_per_sq, matchingPctUm: preset.matching_pct_um, matchingConvention: preset.matching_convention,
    unitOhm: preset.unit_ohm ?? 'auto', switchOhm: preset.switch_ohm, switchSkewS: preset.switch_skew_s, switchChargeC: preset.switch_charge_c,
    switchAreaUm2: preset.switch_area_um2, gateAreaUm2: preset.gate_area_um2, layoutOverhead: preset.layout_overhead,
    minWidthUm: preset.min_width_um, minLengthUm: preset.min_length_um
  }
  const studies = await knex('studies').where({ team_id: team.id, version: 0 }).whereIn('title', STUDIES.map(s => s.title)).select('id', 'owner_id', 'spec')
  for (const study of studies) {
    const spec = typeof study.spec === 'string' ? JSON.parse(study.spec) : study.spec
    // The engine's own schema fills its defaults, so the demo inputs are exactly what it would take.
    const input = evaluateInputSchema.parse({ spec, process })
    await knex.transaction(async (trx) => {
      await writeRevision(trx, {
        studyId: study.id, number: 1, inputs: input, results: null, weights: null,
        engineVersion: ENGINE_VERSION, note: 'Demo data: first inputs, not yet evaluated', authorId: study.owner_id
      })
    })
  }
}
