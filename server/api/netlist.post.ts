import { netlistInputSchema } from '#shared/core/contract/netlist'

/**
 * A plain SPICE netlist of one candidate circuit, with a DC sweep over every code (fixed contract).
 * Built on the worker pool (a 16-bit string DAC is tens of MB) under the user's heavy-request cap.
 */
export default defineApiHandler(async (event): Promise<string> => {
  const user = await requireUser(event)
  const input = await readBodyAs(event, netlistInputSchema)
  const controller = new AbortController()
  event.node.res.once('close', () => {
    if (!event.node.res.writableFinished) controller.abort()
  })
  const json = await withHeavySlot(user, 'netlist', () => netlistJsonInPool(input, controller.signal))
  setResponseHeader(event, 'content-type', 'application/json')
  return json
})
