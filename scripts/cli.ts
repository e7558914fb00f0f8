/**
 * Command-line entry for batch use: `npm run --silent cli -- [--server URL] <command> …`.
 * Without --server the engine runs here; with it, the same commands (and `study …`) go to a
 * Rungwise server with the API token in RUNGWISE_TOKEN. JSON on stdout, messages on stderr.
 * Exit codes: 0 ok; 2 usage error or invalid input (the message names the field and its allowed
 * range); 3 refused by the server; 4 server unreachable; 1 anything else. See scripts/cli/run.ts.
 */
import { readFileSync } from 'node:fs'
import { runCli } from './cli/run'

runCli(process.argv.slice(2), {
  stdout: text => process.stdout.write(text),
  stderr: text => process.stderr.write(text),
  read: source => readFileSync(source === '-' ? 0 : source, 'utf8'),
  env: process.env,
  fetch: globalThis.fetch,
  sleep: ms => new Promise(resolve => setTimeout(resolve, ms))
}).then((code) => {
  process.exitCode = code
})
