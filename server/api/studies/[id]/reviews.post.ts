import { reviewVerdictSchema } from '#shared/schemas/review'
import { idParamSchema } from '#shared/schemas/study'
import type { ReviewStateDto } from '#shared/types/review'

/** A named reviewer signs off the current revision, or requests changes (back to Draft) with a comment. */
export default defineApiHandler(async (event): Promise<ReviewStateDto> => {
  const user = await requireUser(event, 'architect')
  const { id } = paramsAs(event, idParamSchema)
  const body = await readBodyAs(event, reviewVerdictSchema)
  const db = useDb()
  await db.transaction(trx => giveVerdict(trx, user, id, body))
  setResponseStatus(event, 201)
  return reviewState(db, user, id)
})
