import { idParamSchema } from '#shared/schemas/study'
import type { BriefDto } from '#shared/types/brief'

/** The one-page summary of a study (every role of the team reads it). */
export default defineApiHandler(async (event): Promise<BriefDto> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  return studyBrief(useDb(), user, id)
})
