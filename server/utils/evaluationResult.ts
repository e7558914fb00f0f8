import { gunzipSync } from 'node:zlib'

/** Columns that hold a finished job's output (either: `result_gz` for rows written since it exists). */
export const EVALUATION_RESULT_COLUMNS = ['result', 'result_gz'] as const

/** A job row's output as parsed JSON, or null when it has none. */
export function evaluationResultOf<T = unknown>(row: { result?: unknown, result_gz?: Buffer | null }): T | null {
  if (row.result_gz) return JSON.parse(gunzipSync(row.result_gz).toString('utf8')) as T
  if (row.result === null || row.result === undefined) return null
  return (typeof row.result === 'string' ? JSON.parse(row.result) : row.result) as T
}
