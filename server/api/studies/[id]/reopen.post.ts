import { statusChangeSchema } from '#shared/schemas/review'
import { idParamSchema } from '#shared/schemas/study'
import type { ReviewStateDto } from '#shared/types/review'

/** Decided → draft (architects and admins); the decided revision is copied into a new one to edit. */
export default defineApiHandler(async (event): Promise<ReviewStateDto> => {
  const user = await requireUser(event, 'architect', 'admin')
  const { id } = paramsAs(event, idParamSchema)
  const body = await readBodyAs(event, statusChangeSchema)
  const db = useDb()
  await db.transaction(trx => reopen(trx, user, id, body.statusVersion))
  return reviewState(db, user, id)
})
