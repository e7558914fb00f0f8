import { netlistInputSchema, type NetlistOutput } from '#shared/core/contract/netlist'
import { exportNetlist } from '#shared/core/netlist/export'

/** A plain SPICE netlist of one candidate circuit, with a DC sweep over every code (fixed contract). */
export default defineApiHandler(async (event): Promise<NetlistOutput> => {
  await requireUser(event)
  const input = await readBodyAs(event, netlistInputSchema)
  return exportNetlist(input)
})
