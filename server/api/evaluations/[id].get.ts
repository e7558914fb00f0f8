import { z } from 'zod'
import { idParamSchema } from '#shared/schemas/study'
import type { EvaluationJobDto } from '#shared/types/evaluations'

const querySchema = z.object({ result: z.enum(['0', '1'], { error: 'must be 0 or 1' }).default('1') })

export default defineApiHandler(async (event): Promise<EvaluationJobDto> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const { result } = queryAs(event, querySchema)
  const job = await readEvaluationJob(user.teamId, id, result === '1')
  if (!job) throw createError({ statusCode: 404, statusMessage: MESSAGES.notFound })
  return job
})
