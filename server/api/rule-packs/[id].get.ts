import { idParamSchema } from '#shared/schemas/study'
import type { RulePackDto } from '#shared/types/rulePacks'

export default defineApiHandler(async (event): Promise<RulePackDto> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const row = await useDb()('rule_packs').where({ id, team_id: user.teamId }).first()
  if (!row) throw rulePackNotFound()
  return toRulePackDto(row)
})
