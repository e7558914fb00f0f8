import { solveInputSchema } from '#shared/core/contract/solve'

/**
 * Exact solve of one circuit of explicit element values, every code (fixed contract). A 16-bit
 * circuit is 2^16 codes (tenths of a second and megabytes of JSON), so it runs on the worker pool
 * under the user's heavy-request cap (429 beyond), never on the request thread.
 */
export default defineApiHandler(async (event): Promise<string> => {
  const user = await requireUser(event)
  const circuit = await readBodyAs(event, solveInputSchema)
  const signal = clientGone(event)
  const json = await withHeavySlot(user, 'solve', () => solveJsonInPool(circuit, signal))
  setResponseHeader(event, 'content-type', 'application/json')
  return json
})
