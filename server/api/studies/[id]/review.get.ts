import { idParamSchema } from '#shared/schemas/study'
import type { ReviewStateDto } from '#shared/types/review'

/** Who was asked to review, what they said, and every decision (everyone on the team may read it). */
export default defineApiHandler(async (event): Promise<ReviewStateDto> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  return reviewState(useDb(), user, id)
})
