import { rulePackDryRunSchema } from '#shared/schemas/rulePacks'
import { idParamSchema } from '#shared/schemas/study'
import type { RulePackDryRunDto } from '#shared/types/rulePacks'

/** Runs a stored pack (or an edited draft of it, `pack`) against a sample; writes nothing. */
export default defineApiHandler(async (event): Promise<RulePackDryRunDto> => {
  const user = await requireUser(event, ...RULE_PACK_WRITER_ROLES)
  const { id } = paramsAs(event, idParamSchema)
  const body = await readBodyAs(event, rulePackDryRunSchema)
  const row = await useDb()('rule_packs').where({ id, team_id: user.teamId }).first()
  if (!row) throw rulePackNotFound()
  const stored = toRulePackDto(row)
  return await withHeavySlot(user, 'dry-run', () => dryRunPack(user.teamId, { ...(body.pack ?? stored.pack), version: stored.version, source: 'team' }, body))
})
