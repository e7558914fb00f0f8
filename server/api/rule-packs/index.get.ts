import type { RulePackListDto } from '#shared/types/rulePacks'

/** The built-in packs (read-only) and the team's own packs, by pack id. */
export default defineApiHandler(async (event): Promise<RulePackListDto> => {
  const user = await requireUser(event)
  const rows = await useDb()('rule_packs').where({ team_id: user.teamId }).orderBy('pack_id')
  return { builtIn: builtInPackDtos(), team: rows.map(toRulePackDto) }
})
