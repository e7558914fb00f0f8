import { evaluateInputSchema, type EvaluateOutput } from '#shared/core/contract/evaluate'

/** Synchronous evaluation (fixed contract, for scripts): Monte Carlo runs on worker threads, under the user's heavy-request cap. */
export default defineApiHandler(async (event): Promise<EvaluateOutput> => {
  const user = await requireUser(event)
  const input = await readBodyAs(event, evaluateInputSchema)
  const controller = new AbortController()
  // A client that goes away stops its queued tasks.
  event.node.res.once('close', () => {
    if (!event.node.res.writableFinished) controller.abort()
  })
  return await withHeavySlot(user, 'evaluate', () => evaluateWithTeamPacks(user.teamId, input, controller.signal))
})
