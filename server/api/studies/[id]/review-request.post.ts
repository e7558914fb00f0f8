import { reviewRequestSchema } from '#shared/schemas/review'
import { idParamSchema } from '#shared/schemas/study'
import { STUDY_EDITOR_ROLES } from '#shared/types/auth'
import type { ReviewStateDto } from '#shared/types/review'

/** Draft → in review: the owner (or an architect or admin) names the reviewers; each gets one e-mail. */
export default defineApiHandler(async (event): Promise<ReviewStateDto> => {
  const user = await requireUser(event, ...STUDY_EDITOR_ROLES)
  const { id } = paramsAs(event, idParamSchema)
  const body = await readBodyAs(event, reviewRequestSchema)
  const db = useDb()
  await db.transaction(trx => requestReview(trx, user, id, body))
  return reviewState(db, user, id)
})
