import { studyListQuerySchema } from '#shared/schemas/study'
import type { StudyPage } from '#shared/types/studies'

export default defineApiHandler(async (event): Promise<StudyPage> => {
  const user = await requireUser(event)
  const { page, pageSize } = queryAs(event, studyListQuerySchema)
  const db = useDb()
  const [rows, counts] = await Promise.all([
    teamStudies(db, user.teamId).orderBy([{ column: 's.updated_at', order: 'desc' }, { column: 's.id', order: 'desc' }])
      .limit(pageSize).offset((page - 1) * pageSize),
    db('studies').where({ team_id: user.teamId }).count({ total: '*' })
  ])
  return { items: rows.map(toStudyDto), page, pageSize, total: Number(counts[0]?.total ?? 0) }
})
