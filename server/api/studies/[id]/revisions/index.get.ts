import { idParamSchema } from '#shared/schemas/study'
import type { RevisionSummaryDto } from '#shared/types/revisions'

/** A study's History: every revision, newest first, without the (large) results. */
export default defineApiHandler(async (event): Promise<RevisionSummaryDto[]> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const db = useDb()
  await teamStudyRow(db, user.teamId, id)
  const rows = await studyRevisions(db, id).orderBy('r.number', 'desc')
  return rows.map(toRevisionSummary)
})
