/**
 * Field builders for the zod contracts: every failure message states the allowed range and the
 * value received, e.g. `must be an integer from 2 to 16 (got 40)`, so the CLI and the API can
 * print it as is after the field path (see errors.ts).
 */
import { z } from 'zod'

/** Largest array the contracts accept (2^16 values: a 16-bit string). */
export const MAX_ARRAY_VALUES = 2 ** 16

/** Short, safe rendering of a received value for an error message. */
export function describeValue(value: unknown): string {
  if (typeof value === 'number') return String(value)
  if (typeof value === 'string') return JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}…` : value)
  if (value === null) return 'null'
  if (value === undefined) return 'nothing'
  if (Array.isArray(value)) return `an array of ${value.length} values`
  return `a value of type ${typeof value}`
}

interface IssueLike {
  input?: unknown
}

/** A zod error option whose message is `<rule> (got <value>)`, or `is missing; it <rule>`. */
export function says(rule: string): { error: (issue: IssueLike) => string } {
  return {
    error: (issue: IssueLike) => issue.input === undefined
      ? `is missing; it ${rule}`
      : `${rule} (got ${describeValue(issue.input)})`
  }
}

/** Integer in [lo, hi]. */
export function intInRange(lo: number, hi: number) {
  const e = says(`must be an integer from ${lo} to ${hi}`)
  return z.number(e).int(e).min(lo, e).max(hi, e)
}

/** Finite number > 0 (ohms, volts, …). */
export function positive(unit: string) {
  const e = says(`must be a finite number greater than 0 (${unit})`)
  return z.number(e).positive(e)
}

/** Finite number ≥ 0. */
export function nonNegative(unit: string) {
  const e = says(`must be a finite number of at least 0 (${unit})`)
  return z.number(e).nonnegative(e)
}

/** Any finite number. */
export function finite(unit: string) {
  return z.number(says(`must be a finite number (${unit})`))
}

/** Array of positive finite values (ohms); the exact length is checked against `bits` later. */
export function positiveArray(unit: string) {
  const e = says(`must be an array of at most ${MAX_ARRAY_VALUES} positive values (${unit})`)
  return z.array(positive(unit), e).max(MAX_ARRAY_VALUES, e)
}

/** Boolean with a range-stating message. */
export function flag() {
  return z.boolean(says('must be true or false'))
}

/** One of a fixed list of strings. */
export function oneOf<const T extends readonly [string, ...string[]]>(values: T) {
  return z.enum(values, says(`must be one of ${values.join(', ')}`))
}

/** Message for an array whose length does not match the circuit size. */
export function lengthMessage(expected: number, what: string, got: number): string {
  return `must have ${expected} values, ${what} (got ${got})`
}

/** Error option for strict objects: names the unknown keys and the allowed ones. */
export function strictKeys(allowed: readonly string[]) {
  return {
    error: (issue: { code?: string }) => issue.code === 'unrecognized_keys'
      ? `is not a known field (allowed: ${allowed.join(', ')})`
      : 'must be a JSON object'
  }
}
