/** What the CLI touches outside itself, so tests can run it in-process. */
export interface CliIo {
  stdout: (text: string) => void
  stderr: (text: string) => void
  /** reads a file, or stdin for '-' */
  read: (source: string) => string
  env: Record<string, string | undefined>
  fetch: typeof fetch
  /** waits between job polls */
  sleep: (ms: number) => Promise<void>
}

/** Exit codes scripts can rely on. */
export const EXIT = { ok: 0, internal: 1, badInput: 2, refused: 3, unreachable: 4 } as const

/** A failure with the exit code it ends the command with; the message goes to stderr. */
export class CliError extends Error {
  constructor(message: string, readonly code: number) {
    super(message)
  }
}

/** Input documents above this size are refused (a 16-bit string is well under 2 MB). */
export const MAX_INPUT_BYTES = 64 * 2 ** 20

export function readInput(io: CliIo, source: string): string {
  let text: string
  try {
    text = io.read(source)
  } catch (e) {
    throw new CliError(`input: cannot read ${source} (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`, EXIT.badInput)
  }
  if (Buffer.byteLength(text) > MAX_INPUT_BYTES) throw new CliError(`input: must be at most ${MAX_INPUT_BYTES} bytes`, EXIT.badInput)
  return text
}

export function parseJson(text: string): unknown {
  try {
    return JSON.parse(text)
  } catch (e) {
    throw new CliError(`input: must be a JSON document (${(e as Error).message})`, EXIT.badInput)
  }
}

export function printJson(io: CliIo, value: unknown, pretty: boolean): void {
  io.stdout(`${JSON.stringify(value, null, pretty ? 2 : undefined)}\n`)
}
