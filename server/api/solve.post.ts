import { solveInputSchema, type SolveOutput } from '#shared/core/contract/solve'
import { solveCircuit } from '#shared/core/solve'

/** Exact solve of one circuit of explicit element values, every code (fixed contract). */
export default defineApiHandler(async (event): Promise<SolveOutput> => {
  await requireUser(event)
  const circuit = await readBodyAs(event, solveInputSchema)
  return solveCircuit(circuit)
})
