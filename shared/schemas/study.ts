import { z } from 'zod'
import { evaluateSpecSchema, type EvaluateSpec } from '../core/contract/evaluate'
import { canonicalEmail } from '../utils/email'

/** A finite number in [min, max]; every failure message states the allowed range. */
export function rangedNumber(min: number, max: number, unit = '') {
  const error = `must be a number from ${min} to ${max}${unit ? ` ${unit}` : ''}`
  return z.number({ error }).min(min, { error }).max(max, { error })
}

/** An integer in [min, max]; accepts numeric strings (query and route parameters). */
export function rangedInteger(min: number, max: number, coerce = false) {
  const error = `must be an integer from ${min} to ${max}`
  const integer = z.number({ error }).int({ error }).min(min, { error }).max(max, { error })
  // Path and query values arrive as text: only plain digits are read as a number, so "1 ", "1e0"
  // or "0x1" are refused instead of silently naming record 1.
  return coerce ? z.preprocess(v => (typeof v === 'string' && /^-?[0-9]{1,16}$/.test(v) ? Number(v) : v), integer) : integer
}

/**
 * A study's spec is the engine's spec (every field of the evaluate contract, SI units); the ranges
 * and messages are the engine's own, so the form, the API and the CLI agree.
 */
export const studySpecSchema = evaluateSpecSchema

const TITLE_ERROR = 'is required, 1 to 200 characters'

export const studyCreateSchema = z.object({
  title: z.string({ error: TITLE_ERROR }).trim().min(1, { error: TITLE_ERROR }).max(200, { error: TITLE_ERROR }),
  blockName: z.string({ error: 'must be text of at most 120 characters' }).trim()
    .max(120, { error: 'must be text of at most 120 characters' }).nullish(),
  spec: studySpecSchema
}).strict()

export const studyListQuerySchema = z.object({
  page: rangedInteger(1, 100_000, true).default(1),
  pageSize: rangedInteger(1, 100, true).default(25)
})

export const idParamSchema = z.object({ id: rangedInteger(1, 2 ** 31 - 1, true) })

export const signInSchema = z.object({
  email: z.string().max(1000).transform(canonicalEmail).pipe(z.string().max(254)),
  password: z.string().max(200)
})

export type StudySpec = EvaluateSpec
export type StudyCreate = z.infer<typeof studyCreateSchema>
