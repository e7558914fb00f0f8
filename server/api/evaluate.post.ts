import { evaluateInputSchema } from '#shared/core/contract/evaluate'

/** Synchronous evaluation (fixed contract, for scripts): Monte Carlo runs on worker threads, under the user's heavy-request cap. */
export default defineApiHandler(async (event): Promise<string> => {
  const user = await requireUser(event)
  const input = await readBodyAs(event, evaluateInputSchema)
  const controller = new AbortController()
  // A client that goes away stops its queued tasks.
  event.node.res.once('close', () => {
    if (!event.node.res.writableFinished) controller.abort()
  })
  // The output (megabytes at 16 bits) arrives as JSON text serialised on a worker thread.
  const json = await withHeavySlot(user, 'evaluate', async () => evaluateInPoolJson(input, { signal: controller.signal, packs: await enabledTeamPacks(user.teamId) }))
  setResponseHeader(event, 'content-type', 'application/json')
  return json
})
