import type { EvaluationJobDto } from '../../shared/types/evaluations'
import type { RevisionDto, RevisionSummaryDto } from '../../shared/types/revisions'
import type { StudyDto } from '../../shared/types/studies'
import { CliError, EXIT, parseJson, printJson, readInput, type CliIo } from './io'

/**
 * The CLI against a Rungwise server: the same JSON documents and outputs as the local commands,
 * through the API with a personal token (RUNGWISE_TOKEN). HTTP statuses become exit codes:
 * 400/413/415/422 bad input (2); 401/403/404/409/423/429 refused (3); no answer, 502/503/504
 * unreachable (4); anything else internal (1).
 */
export interface Remote {
  io: CliIo
  base: string
  token: string | undefined
  timeoutMs: number
  pretty: boolean
}

const BAD_INPUT = new Set([400, 413, 415, 422])
const REFUSED = new Set([401, 403, 404, 409, 423, 429])
const UNREACHABLE = new Set([502, 503, 504])

function exitFor(status: number): number {
  if (BAD_INPUT.has(status)) return EXIT.badInput
  if (REFUSED.has(status)) return EXIT.refused
  return UNREACHABLE.has(status) ? EXIT.unreachable : EXIT.internal
}

export function serverBase(url: string): string {
  let parsed: URL
  try {
    parsed = new URL(url)
  } catch {
    throw new CliError(`--server: must be an http or https address such as http://127.0.0.1:3000 (got ${JSON.stringify(url)})`, EXIT.badInput)
  }
  if (parsed.protocol !== 'http:' && parsed.protocol !== 'https:') throw new CliError(`--server: must be an http or https address (got ${parsed.protocol})`, EXIT.badInput)
  return `${parsed.origin}${parsed.pathname.replace(/\/$/, '')}`
}

/** One API call; the answer's JSON, or a CliError carrying the server's message and the exit code. */
export async function call<T>(r: Remote, method: string, path: string, body?: unknown): Promise<T> {
  const headers: Record<string, string> = { accept: 'application/json' }
  if (r.token) headers.authorization = `Bearer ${r.token}`
  if (body !== undefined) headers['content-type'] = 'application/json'
  let res: Response
  try {
    res = await r.io.fetch(`${r.base}${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body), signal: AbortSignal.timeout(r.timeoutMs) })
  } catch (e) {
    const cause = (e as { cause?: { code?: string } }).cause?.code ?? (e as Error).name
    throw new CliError(`server: no answer from ${r.base} (${cause})`, EXIT.unreachable)
  }
  const text = await res.text()
  if (res.ok) return (text ? JSON.parse(text) : null) as T
  let message = text.slice(0, 500)
  try {
    const b = JSON.parse(text) as { message?: string, statusMessage?: string }
    message = b.message ?? b.statusMessage ?? message
  } catch {
    // not JSON: the text as it came
  }
  const hint = res.status === 401 && !r.token ? ' (set RUNGWISE_TOKEN to an API token: Settings → API tokens)' : ''
  throw new CliError(`${res.status}: ${message}${hint}`, exitFor(res.status))
}

const ENGINE_ROUTES: Record<string, string> = { solve: '/api/solve', evaluate: '/api/evaluate', netlist: '/api/netlist' }

/** solve, evaluate, netlist: the document goes to the server as it is; its validation is the contract's. */
export async function remoteEngine(r: Remote, name: string, source: string): Promise<number> {
  const input = parseJson(readInput(r.io, source))
  printJson(r.io, await call(r, 'POST', ENGINE_ROUTES[name]!, input), r.pretty)
  return EXIT.ok
}

export async function studyList(r: Remote, page: number, pageSize: number): Promise<number> {
  printJson(r.io, await call(r, 'GET', `/api/studies?page=${page}&pageSize=${pageSize}`), r.pretty)
  return EXIT.ok
}

/** The newest revision that carries results: `{ studyId, revision, engineVersion, createdAt, results }`. */
export async function studyResults(r: Remote, id: number): Promise<number> {
  const revisions = await call<RevisionSummaryDto[]>(r, 'GET', `/api/studies/${id}/revisions`)
  const newest = revisions.find(x => x.hasResults)
  if (!newest) throw new CliError(`study ${id}: no revision has results yet (save one with study save --evaluate)`, EXIT.refused)
  const rev = await call<RevisionDto>(r, 'GET', `/api/studies/${id}/revisions/${newest.number}`)
  printJson(r.io, { studyId: id, revision: rev.number, engineVersion: rev.engineVersion, createdAt: rev.createdAt, results: rev.results }, r.pretty)
  return EXIT.ok
}

async function finishedJob(r: Remote, inputs: unknown, pollMs: number): Promise<number> {
  let job = await call<EvaluationJobDto>(r, 'POST', '/api/evaluations', inputs)
  while (job.status === 'queued' || job.status === 'running') {
    await r.io.sleep(pollMs)
    job = await call<EvaluationJobDto>(r, 'GET', `/api/evaluations/${job.id}?result=0`)
  }
  if (job.status !== 'done') throw new CliError(`evaluation ${job.id} ${job.status}${job.error ? `: ${job.error}` : ''}`, job.status === 'cancelled' ? EXIT.refused : EXIT.internal)
  return job.id
}

/**
 * Saves the next revision from `{ spec, process, options, note?, weights?, baseVersion? }`; without
 * baseVersion, on the study's current head. With `evaluate`, runs an evaluation job of exactly
 * these inputs first and saves its results with the revision.
 */
export async function studySave(r: Remote, id: number, source: string, evaluate: boolean, pollMs: number): Promise<number> {
  const doc = parseJson(readInput(r.io, source))
  if (!doc || typeof doc !== 'object' || Array.isArray(doc)) throw new CliError('input: must be a JSON object { spec, process, options, note?, weights?, baseVersion? }', EXIT.badInput)
  const body = { ...doc as Record<string, unknown> }
  body.baseVersion ??= (await call<StudyDto>(r, 'GET', `/api/studies/${id}`)).version
  if (evaluate) body.evaluationId = await finishedJob(r, { spec: body.spec, process: body.process, options: body.options }, pollMs)
  printJson(r.io, await call(r, 'POST', `/api/studies/${id}/revisions`, body), r.pretty)
  return EXIT.ok
}
