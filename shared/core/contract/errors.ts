/**
 * One formatter of validation errors for the CLI (stderr, exit 2) and the API (400): the message
 * names the field path and the allowed range, e.g. `bits: must be an integer from 2 to 16 (got 40)`.
 */
import type { z } from 'zod'

export interface FormattedIssue {
  /** dotted field path with array indices, e.g. `circuit.legsOhm[3]`; `(input)` for the root */
  path: string
  message: string
}

export interface FormattedError {
  /** human-readable summary: the first issues joined by `; ` */
  message: string
  issues: FormattedIssue[]
}

/** At most this many issues are listed (a 65,536-value array can fail everywhere). */
export const MAX_LISTED_ISSUES = 20
const MAX_IN_MESSAGE = 3

/** Renders a zod issue path as `a.b[3].c`; keys that are not plain names are quoted, `["my key"]`. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = ''
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`
    else if (typeof key === 'string' && /^[A-Za-z_$][\w$]*$/.test(key)) out += out === '' ? key : `.${key}`
    else out += `[${JSON.stringify(String(key))}]`
  }
  return out === '' ? '(input)' : out
}

/**
 * Flattens one issue. A failed union reports the branch that came closest (fewest issues),
 * with the union's own path in front, so `{ circuit: { bits: 99 } }` says `circuit.bits: …`.
 */
function toFormatted(issue: z.core.$ZodIssue): FormattedIssue[] {
  if (issue.code === 'invalid_union' && issue.errors.length > 0) {
    const best = issue.errors.reduce((a, b) => (b.length < a.length ? b : a))
    return best.flatMap(i => toFormatted({ ...i, path: [...issue.path, ...i.path] } as z.core.$ZodIssue))
  }
  if (issue.code === 'unrecognized_keys') {
    return issue.keys.map(key => ({ path: formatPath([...issue.path, key]), message: issue.message }))
  }
  return [{ path: formatPath(issue.path), message: issue.message }]
}

/**
 * Formats a zod error for people and scripts.
 * @returns `message` (e.g. `legsOhm[2]: must be a finite number greater than 0 (ohms) (got -5)`,
 *   with `(and N more)` when issues were left out) and the listed `issues`
 */
export function formatIssues(error: z.core.$ZodError): FormattedError {
  const all = error.issues.flatMap(toFormatted)
  const issues = all.slice(0, MAX_LISTED_ISSUES)
  const head = all.slice(0, MAX_IN_MESSAGE).map(i => `${i.path}: ${i.message}`).join('; ')
  const rest = all.length - MAX_IN_MESSAGE
  const message = rest > 0 ? `${head} (and ${rest} more)` : head
  return { message, issues }
}
