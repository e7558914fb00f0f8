import { idParamSchema } from '#shared/schemas/study'
import type { StudyDto } from '#shared/types/studies'

export default defineApiHandler(async (event): Promise<StudyDto> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  // Another team's study is indistinguishable from a missing one.
  const row = await teamStudies(useDb(), user.teamId).where('s.id', id).first()
  if (!row) throw createError({ statusCode: 404, statusMessage: MESSAGES.notFound })
  return toStudyDto(row)
})
