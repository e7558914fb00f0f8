import { revisionParamsSchema } from '#shared/schemas/revisions'
import type { RevisionDto } from '#shared/types/revisions'

/** One revision with its inputs and results. */
export default defineApiHandler(async (event): Promise<RevisionDto> => {
  const user = await requireUser(event)
  const { id, n } = paramsAs(event, revisionParamsSchema)
  const db = useDb()
  await teamStudyRow(db, user.teamId, id)
  const row = await studyRevisions(db, id, true).where('r.number', n).first()
  if (!row) throw notFound()
  return toRevisionDto(row)
})
