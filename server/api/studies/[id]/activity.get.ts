import { idParamSchema } from '#shared/schemas/study'
import type { ActivityDto } from '#shared/types/review'

/**
 * A study's history from the audit log, newest first: everything aimed at the study (creation,
 * revisions, status changes, decisions) and every `note.*` action whose detail names the study.
 */
export default defineApiHandler(async (event): Promise<ActivityDto[]> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const db = useDb()
  if (!(await db('studies').where({ id, team_id: user.teamId }).first('id'))) throw notFound()
  const rows = await db('audit_log as a').leftJoin('users as u', 'u.id', 'a.actor_id').where('a.team_id', user.teamId)
    .where(w => w.where({ 'a.target_type': 'study', 'a.target_id': String(id) })
      .orWhere(n => n.where('a.action', 'like', 'note.%').andWhereRaw('JSON_VALUE(a.detail, \'$.studyId\') = ?', [String(id)])))
    .orderBy('a.id', 'desc').limit(200)
    .select('a.id', 'a.action', 'u.display_name as actor', 'a.detail', 'a.created_at')
  return rows.map(r => ({
    id: Number(r.id), action: r.action, actor: r.actor ?? null,
    detail: r.detail === null ? null : typeof r.detail === 'string' ? JSON.parse(r.detail) : r.detail,
    createdAt: new Date(r.created_at).toISOString()
  }))
})
