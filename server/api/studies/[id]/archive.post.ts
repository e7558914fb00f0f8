import { statusChangeSchema } from '#shared/schemas/review'
import { idParamSchema } from '#shared/schemas/study'
import type { ReviewStateDto } from '#shared/types/review'

/** Decided → archived (architects and admins). */
export default defineApiHandler(async (event): Promise<ReviewStateDto> => {
  const user = await requireUser(event, 'architect', 'admin')
  const { id } = paramsAs(event, idParamSchema)
  const body = await readBodyAs(event, statusChangeSchema)
  const db = useDb()
  await db.transaction(trx => archive(trx, user, id, body.statusVersion))
  return reviewState(db, user, id)
})
