import { CliError, EXIT, type CliIo } from './io'
import { remoteEngine, serverBase, studyList, studyResults, studySave, type Remote } from './remote'

export const USAGE = `usage: npm run --silent cli -- <command> <file.json|-> [--pretty]
       npm run --silent cli -- --server URL <command> … [--pretty]
engine (on this machine, or on the server with --server):
  solve <file.json|->      exact solve of one circuit (every code: voutV or ioutA, irefA, routOhm)
  evaluate <file.json|->   trade-study evaluation of a spec (spec, process, options)
  netlist <file.json|->    SPICE netlist of one circuit ({ circuit }) or of a sized candidate
                           ({ spec, process, candidate, sample: null | { seed, index } });
                           "deck": "portable" gives a plain SPICE deck for any simulator
studies (with --server only):
  study list [--page N] [--page-size N]
  study results <id>       the newest revision with results
  study save <id> <file.json|-> [--evaluate]
                           next revision from { spec, process, options, note?, baseVersion? };
                           --evaluate runs an evaluation job first and saves its results
'-' reads the JSON document from stdin. --server (or RUNGWISE_SERVER) names the server; the API
token comes from RUNGWISE_TOKEN. Exit codes: 0 ok, 2 bad input, 3 refused, 4 unreachable, 1 other.`

/** The engine commands; the engine itself is loaded only to run one here (remote runs and usage errors start faster). */
const ENGINE_COMMANDS = ['solve', 'evaluate', 'netlist']

interface Parsed {
  args: string[]
  server?: string
  pretty: boolean
  evaluate: boolean
  page: number
  pageSize: number
}

function count(flag: string, value: string | undefined, lo: number, hi: number): number {
  const n = Number(value)
  if (!/^\d+$/.test(value ?? '') || n < lo || n > hi) throw new CliError(`${flag}: must be an integer from ${lo} to ${hi} (got ${JSON.stringify(value ?? null)})`, EXIT.badInput)
  return n
}

function parse(argv: string[], env: CliIo['env']): Parsed {
  const p: Parsed = { args: [], server: env.RUNGWISE_SERVER || undefined, pretty: false, evaluate: false, page: 1, pageSize: 25 }
  for (let i = 0; i < argv.length; i++) {
    const [a, inline] = argv[i]!.split(/=(.*)/s, 2) as [string, string | undefined]
    const value = () => inline ?? argv[++i]
    if (a === '--pretty') p.pretty = true
    else if (a === '--evaluate') p.evaluate = true
    else if (a === '--server') p.server = value()
    else if (a === '--page') p.page = count('--page', value(), 1, 100_000)
    else if (a === '--page-size') p.pageSize = count('--page-size', value(), 1, 100)
    else if (a.startsWith('--')) throw new CliError(`unknown option: ${a}\n${USAGE}`, EXIT.badInput)
    else p.args.push(argv[i]!)
  }
  return p
}

function usage(message: string): CliError {
  return new CliError(`${message}\n${USAGE}`, EXIT.badInput)
}

function studyId(value: string | undefined): number {
  return count('study id', value, 1, 2 ** 31 - 1)
}

async function dispatch(argv: string[], io: CliIo): Promise<number> {
  const p = parse(argv, io.env)
  const [name, ...rest] = p.args
  if (name === undefined) throw usage('no command given')
  if (p.server === undefined) {
    if (name === 'study') throw usage('study commands need --server URL (or RUNGWISE_SERVER)')
    if (!ENGINE_COMMANDS.includes(name)) throw usage(`unknown command: ${name}`)
    if (rest.length !== 1) throw usage(`${name} takes one input: a file or -`)
    const { runLocal } = await import('./local')
    return runLocal(io, name, rest[0]!, p.pretty)
  }
  const timeoutS = Number(io.env.RUNGWISE_TIMEOUT_S ?? 600)
  const r: Remote = { io, base: serverBase(p.server), token: io.env.RUNGWISE_TOKEN || undefined, timeoutMs: (Number.isFinite(timeoutS) && timeoutS > 0 ? timeoutS : 600) * 1000, pretty: p.pretty }
  if (ENGINE_COMMANDS.includes(name)) {
    if (rest.length !== 1) throw usage(`${name} takes one input: a file or -`)
    return remoteEngine(r, name, rest[0]!)
  }
  if (name !== 'study') throw usage(`unknown command: ${name}`)
  const [sub, ...more] = rest
  if (sub === 'list' && more.length === 0) return studyList(r, p.page, p.pageSize)
  if (sub === 'results' && more.length === 1) return studyResults(r, studyId(more[0]))
  if (sub === 'save' && more.length === 2) return studySave(r, studyId(more[0]), more[1]!, p.evaluate, Number(io.env.RUNGWISE_POLL_MS ?? 1000))
  throw usage(`study ${sub ?? ''}: expected list, results <id> or save <id> <file.json|->`)
}

/** Runs one CLI invocation and returns its exit code; messages go to stderr, results to stdout. */
export async function runCli(argv: string[], io: CliIo): Promise<number> {
  try {
    return await dispatch(argv, io)
  } catch (e) {
    if (e instanceof CliError) {
      io.stderr(`${e.message}\n`)
      return e.code
    }
    io.stderr(`internal error: ${e instanceof Error ? e.message : String(e)}\n`)
    return EXIT.internal
  }
}
