import { idParamSchema } from '#shared/schemas/study'
import type { EvaluationJobDto } from '#shared/types/evaluations'

/** Cancels a queued or running evaluation (its owner or an admin); a finished one stays as it is. */
export default defineApiHandler(async (event): Promise<EvaluationJobDto> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const job = await readEvaluationJob(user.teamId, id, false)
  if (!job) throw createError({ statusCode: 404, statusMessage: MESSAGES.notFound })
  if (job.userId !== user.id && user.role !== 'admin') throw createError({ statusCode: 403, statusMessage: MESSAGES.forbidden })
  await cancelEvaluationJob(user.teamId, id, user)
  return (await readEvaluationJob(user.teamId, id, false))!
})
