import { studyListQuerySchema } from '#shared/schemas/study'
import type { StudyPage } from '#shared/types/studies'

export default defineApiHandler(async (event): Promise<StudyPage> => {
  const user = await requireUser(event)
  const { page, pageSize } = queryAs(event, studyListQuerySchema)
  const db = useDb()
  const [rows, counts] = await Promise.all([
    teamStudiesPage(db, user.teamId, pageSize, (page - 1) * pageSize),
    db('studies').where({ team_id: user.teamId }).count({ total: '*' })
  ])
  return { items: rows.map(toStudyDto), page, pageSize, total: Number(counts[0]?.total ?? 0) }
})
