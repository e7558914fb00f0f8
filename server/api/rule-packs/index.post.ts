import { rulePackCreateSchema } from '#shared/schemas/rulePacks'
import type { RulePackDto } from '#shared/types/rulePacks'

/** Creates a team pack (version 1) with its first history row and an audit row, in one transaction. */
export default defineApiHandler(async (event): Promise<RulePackDto> => {
  const user = await requireUser(event, ...RULE_PACK_WRITER_ROLES)
  const { pack, enabled } = await readBodyAs(event, rulePackCreateSchema)
  const db = useDb()
  const id = await writeTransaction(async (trx) => {
    const taken = await trx('rule_packs').where({ team_id: user.teamId, pack_id: pack.id }).first('id')
    if (taken) throw rulePackConflict(`pack.id: your team already has a rule pack with id ${pack.id}; choose another id`)
    const [rowId] = await trx('rule_packs').insert({
      team_id: user.teamId, pack_id: pack.id, name: pack.name, pack: JSON.stringify(pack), enabled, version: 1, created_by: user.id, updated_by: user.id
    })
    await writePackVersion(trx, rowId!, 1, pack, enabled, user.id, 'created')
    await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'rule_pack_created', targetType: 'rule_pack', targetId: rowId!, detail: { packId: pack.id, enabled, rules: pack.rules.length } }, trx)
    return rowId!
  })
  setResponseStatus(event, 201)
  return toRulePackDto(await db('rule_packs').where({ id }).first())
})
