import { decisionSchema } from '#shared/schemas/review'
import { idParamSchema } from '#shared/schemas/study'
import type { ReviewStateDto } from '#shared/types/review'

/** In review → decided (architects and admins): the owner and the reviewers get the decision by e-mail. */
export default defineApiHandler(async (event): Promise<ReviewStateDto> => {
  const user = await requireUser(event, 'architect', 'admin')
  const { id } = paramsAs(event, idParamSchema)
  const body = await readBodyAs(event, decisionSchema)
  const db = useDb()
  await db.transaction(trx => decide(trx, user, id, body))
  setResponseStatus(event, 201)
  return reviewState(db, user, id)
})
