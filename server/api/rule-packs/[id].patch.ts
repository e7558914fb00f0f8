import { rulePackPatchSchema } from '#shared/schemas/rulePacks'
import { idParamSchema } from '#shared/schemas/study'
import type { RulePackDto } from '#shared/types/rulePacks'

/** Edits the rules and/or enables or disables a pack if `version` is still current (409 otherwise). */
export default defineApiHandler(async (event): Promise<RulePackDto> => {
  const user = await requireUser(event, ...RULE_PACK_WRITER_ROLES)
  const { id } = paramsAs(event, idParamSchema)
  const body = await readBodyAs(event, rulePackPatchSchema)
  const db = useDb()
  await writeTransaction(async (trx) => {
    const row = await trx('rule_packs').where({ id, team_id: user.teamId }).forUpdate().first()
    if (!row) throw rulePackNotFound()
    if (row.version !== body.version) {
      throw rulePackConflict(`version: this pack was changed by someone else (you edited version ${body.version}, the current one is ${row.version}); reload it and apply your changes again`, row.version)
    }
    const current = toRulePackDto(row)
    const pack = body.pack ?? current.pack
    if (pack.id !== current.packId) throw rulePackConflict(`pack.id: a pack keeps its id (${current.packId}); create a new pack for a new id`)
    const enabled = body.enabled ?? current.enabled
    const version = row.version + 1
    const change = [body.pack ? 'rules edited' : null, body.enabled === undefined || body.enabled === current.enabled ? null : enabled ? 'enabled' : 'disabled'].filter(Boolean).join(', ') || 'saved'
    await trx('rule_packs').where({ id }).update({ name: pack.name, pack: JSON.stringify(pack), enabled, version, updated_by: user.id, updated_at: trx.fn.now() })
    await writePackVersion(trx, id, version, pack, enabled, user.id, change)
    await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'rule_pack_updated', targetType: 'rule_pack', targetId: id, detail: { packId: current.packId, fromVersion: body.version, change } }, trx)
  })
  return toRulePackDto(await db('rule_packs').where({ id }).first())
})
