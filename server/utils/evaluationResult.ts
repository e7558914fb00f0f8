import { gunzipSync, gzipSync } from 'node:zlib'

/** How an evaluation's output leaves the worker: the object, its JSON text, or that text gzip-compressed. */
export type OutputForm = 'object' | 'json' | 'gzip'

/** The output in the form asked for (the worker thread runs this; the inline fallback too). */
export function encodeEvaluationOutput<T>(output: T, form: OutputForm): T | string | Buffer {
  if (form === 'object') return output
  const text = JSON.stringify(output)
  return form === 'gzip' ? gzipSync(text, { level: 3 }) : text
}

/** Columns that hold a finished job's output (either: `result_gz` for rows written since it exists). */
export const EVALUATION_RESULT_COLUMNS = ['result', 'result_gz'] as const

/** A job row's output as parsed JSON, or null when it has none. */
export function evaluationResultOf<T = unknown>(row: { result?: unknown, result_gz?: Buffer | null }): T | null {
  if (row.result_gz) return JSON.parse(gunzipSync(row.result_gz).toString('utf8')) as T
  if (row.result === null || row.result === undefined) return null
  return (typeof row.result === 'string' ? JSON.parse(row.result) : row.result) as T
}
