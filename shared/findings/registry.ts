/**
 * The built-in rule packs, imported explicitly so they load the same in the server and browser
 * bundles. Each is validated when this module loads; a broken file throws RulePackError naming
 * the file, the rule and the field.
 */
import core from '../../rules/rungwise-core.json'
import type { RulePack } from './schema'
import { loadRulePack } from './validate'

export const BUILT_IN_PACKS: readonly RulePack[] = [
  loadRulePack(core, 'rules/rungwise-core.json')
]

/** Ids that team packs may not take (they would shadow a built-in pack in the findings). */
export const BUILT_IN_PACK_IDS: readonly string[] = BUILT_IN_PACKS.map(p => p.id)
