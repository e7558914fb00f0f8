import { evaluateInputSchema } from '#shared/core/contract/evaluate'
import type { EvaluationJobDto } from '#shared/types/evaluations'

/** Starts an evaluation job (202); poll GET /api/evaluations/[id] for progress and the result. */
export default defineApiHandler(async (event): Promise<EvaluationJobDto> => {
  const user = await requireUser(event)
  const input = await readBodyAs(event, evaluateInputSchema)
  const id = await startEvaluationJob(user, input)
  setResponseStatus(event, 202)
  return (await readEvaluationJob(user.teamId, id, false))!
})
