import type { z } from 'zod'
import { formatIssues } from '../../shared/core/contract/errors'
import { evaluateInputSchema, type EvaluateInput } from '../../shared/core/contract/evaluate'
import { netlistInputSchema } from '../../shared/core/contract/netlist'
import { solveInputSchema } from '../../shared/core/contract/solve'
import { evaluateSpec } from '../../shared/core/evaluate'
import { exportNetlist } from '../../shared/core/netlist/export'
import { solveCircuit } from '../../shared/core/solve/index'
import { applyFindings } from '../../shared/findings/index'
import { CliError, EXIT, parseJson, printJson, readInput, type CliIo } from './io'

interface Command {
  schema: z.ZodType
  run: (input: never) => unknown
}

export const LOCAL_COMMANDS: Record<string, Command> = {
  solve: { schema: solveInputSchema, run: solveCircuit },
  // the same findings, ranking and recommendation as POST /api/evaluate (built-in rule packs)
  evaluate: { schema: evaluateInputSchema, run: (input: EvaluateInput) => applyFindings(input, evaluateSpec(input)) },
  netlist: { schema: netlistInputSchema, run: exportNetlist }
}

/** The engine on this machine: validates the document with the contract's schema and prints the result. */
export async function runLocal(io: CliIo, name: string, source: string, pretty: boolean): Promise<number> {
  const command = LOCAL_COMMANDS[name]!
  const parsed = command.schema.safeParse(parseJson(readInput(io, source)))
  if (!parsed.success) throw new CliError(formatIssues(parsed.error).message, EXIT.badInput)
  printJson(io, await command.run(parsed.data as never), pretty)
  return EXIT.ok
}
