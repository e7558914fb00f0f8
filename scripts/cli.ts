/**
 * Command-line entry for batch use: `npm run --silent cli -- <command> <file.json|->`.
 * Reads one JSON document (a file, or stdin for `-`), prints the JSON result on stdout.
 * Exit codes: 0 success; 2 usage error or invalid input (message on stderr, naming the field
 * and the allowed range); 1 unexpected internal error.
 */
import { readFileSync } from 'node:fs'
import type { z } from 'zod'
import { formatIssues } from '../shared/core/contract/errors'
import { evaluateInputSchema, type EvaluateInput } from '../shared/core/contract/evaluate'
import { netlistInputSchema } from '../shared/core/contract/netlist'
import { solveInputSchema } from '../shared/core/contract/solve'
import { evaluateSpec } from '../shared/core/evaluate'
import { applyFindings } from '../shared/findings/index'
import { exportNetlist } from '../shared/core/netlist/export'
import { solveCircuit } from '../shared/core/solve/index'

const USAGE = `usage: npm run --silent cli -- <command> <file.json|-> [--pretty]
commands:
  solve     exact solve of one circuit (every code: voutV or ioutA, irefA, routOhm)
  evaluate  trade-study evaluation of a spec (spec, process, options)
  netlist   SPICE netlist of one circuit ({ circuit }) or of a sized candidate
            ({ spec, process, candidate, sample: null | { seed, index } })
'-' reads the JSON document from stdin.`

/** Input documents above this size are refused (a 16-bit string is well under 2 MB). */
const MAX_INPUT_BYTES = 64 * 2 ** 20

class UsageError extends Error {}

interface Command {
  schema: z.ZodType
  run: (input: never) => unknown
}

const COMMANDS: Record<string, Command> = {
  solve: { schema: solveInputSchema, run: solveCircuit },
  // the same findings, ranking and recommendation as POST /api/evaluate (built-in rule packs)
  evaluate: { schema: evaluateInputSchema, run: (input: EvaluateInput) => applyFindings(input, evaluateSpec(input)) },
  netlist: { schema: netlistInputSchema, run: exportNetlist }
}

function readInput(source: string): string {
  const text = source === '-' ? readFileSync(0, 'utf8') : readFileSync(source, 'utf8')
  if (Buffer.byteLength(text) > MAX_INPUT_BYTES) throw new UsageError(`input: must be at most ${MAX_INPUT_BYTES} bytes`)
  return text
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text)
  } catch (e) {
    throw new UsageError(`input: must be a JSON document (${(e as Error).message})`)
  }
}

async function main(argv: string[]): Promise<number> {
  const pretty = argv.includes('--pretty')
  const args = argv.filter(a => a !== '--pretty')
  const [name, source, ...extra] = args
  const command = name !== undefined && Object.hasOwn(COMMANDS, name) ? COMMANDS[name] : undefined
  if (!command || source === undefined || extra.length > 0) {
    process.stderr.write(`${name && !command ? `unknown command: ${name}\n` : ''}${USAGE}\n`)
    return 2
  }
  let text: string
  try {
    text = readInput(source)
  } catch (e) {
    if (e instanceof UsageError) throw e
    throw new UsageError(`input: cannot read ${source} (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`)
  }
  const parsed = command.schema.safeParse(parseJson(text))
  if (!parsed.success) {
    process.stderr.write(`${formatIssues(parsed.error).message}\n`)
    return 2
  }
  const result = await command.run(parsed.data as never)
  process.stdout.write(`${JSON.stringify(result, null, pretty ? 2 : undefined)}\n`)
  return 0
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code
  },
  (e: unknown) => {
    if (e instanceof UsageError) {
      process.stderr.write(`${e.message}\n`)
      process.exitCode = 2
      return
    }
    process.stderr.write(`internal error: ${e instanceof Error ? e.message : String(e)}\n`)
    process.exitCode = 1
  }
)
