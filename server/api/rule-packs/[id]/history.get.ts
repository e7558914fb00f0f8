import { idParamSchema } from '#shared/schemas/study'
import type { RulePackVersionDto } from '#shared/types/rulePacks'

/** Every saved version of a pack, newest first. */
export default defineApiHandler(async (event): Promise<RulePackVersionDto[]> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const db = useDb()
  const pack = await db('rule_packs').where({ id, team_id: user.teamId }).first('id')
  if (!pack) throw rulePackNotFound()
  const rows = await db('rule_pack_versions as v').leftJoin('users as u', 'u.id', 'v.author_id').where('v.rule_pack_id', id)
    .orderBy('v.version', 'desc').select('v.version', 'v.enabled', 'v.change', 'v.pack', 'v.created_at', 'u.display_name as author_name')
  return rows.map(r => ({
    version: r.version, enabled: Boolean(r.enabled), change: r.change, authorName: r.author_name ?? null,
    createdAt: new Date(r.created_at).toISOString(), pack: typeof r.pack === 'string' ? JSON.parse(r.pack) : r.pack
  }))
})
