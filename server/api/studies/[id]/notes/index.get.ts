import { idParamSchema } from '#shared/schemas/study'
import type { NoteThreadDto } from '#shared/types/notes'

/** The study's notes as threads (every role of the team reads them; another team's study is 404). */
export default defineApiHandler(async (event): Promise<NoteThreadDto[]> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const db = useDb()
  await teamStudyRow(db, user.teamId, id)
  return studyThreads(db, user.teamId, id)
})
