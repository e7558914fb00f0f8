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

/**
 * Element values the solver accepts (ohms): wide enough for any real resistor or switch, narrow
 * enough that products and ratios of values stay far from floating-point overflow.
 */
export const MIN_OHM = 1e-6
export const MAX_OHM = 1e15
/** Largest |voltage| accepted (V). */
export const MAX_VOLT = 1e6
/** Smallest reference voltage accepted (V). */
export const MIN_VREF = 1e-6

/** A bound for a message: 1e-6 and 1e15 rather than 0.000001 and 1000000000000000. */
export function showBound(x: number): string {
  const a = Math.abs(x)
  return a !== 0 && (a >= 1e6 || a < 1e-3) ? x.toExponential().replace('e+', 'e') : String(x)
}

/** Finite number in [lo, hi] with its unit. */
export function inRange(lo: number, hi: number, unit: string) {
  const e = says(`must be a finite number from ${showBound(lo)} to ${showBound(hi)} (${unit})`)
  return z.number(e).min(lo, e).max(hi, e)
}

/** Finite number in (0, hi] with its unit. */
export function positiveUpTo(hi: number, unit: string) {
  const e = says(`must be a finite number greater than 0 and at most ${showBound(hi)} (${unit})`)
  return z.number(e).positive(e).max(hi, e)
}

/** A resistance in [MIN_OHM, MAX_OHM]. */
export function ohms() {
  return inRange(MIN_OHM, MAX_OHM, 'ohms')
}

/** Array of resistances; the exact length is checked against `bits` later. */
export function ohmsArray() {
  const e = says(`must be an array of at most ${MAX_ARRAY_VALUES} resistances from ${showBound(MIN_OHM)} to ${showBound(MAX_OHM)} ohms`)
  return z.array(ohms(), e).max(MAX_ARRAY_VALUES, e)
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
