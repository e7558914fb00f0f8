import { z } from 'zod'

/** A finite number in [min, max]; every failure message states the allowed range. */
export function rangedNumber(min: number, max: number, unit = '') {
  const error = `must be a number from ${min} to ${max}${unit ? ` ${unit}` : ''}`
  return z.number({ error }).min(min, { error }).max(max, { error })
}

/** An integer in [min, max]; accepts numeric strings (query and route parameters). */
export function rangedInteger(min: number, max: number, coerce = false) {
  const error = `must be an integer from ${min} to ${max}`
  return (coerce ? z.coerce.number({ error }) : z.number({ error })).int({ error }).min(min, { error }).max(max, { error })
}

const SPEC_FIELDS = ['bits', 'vrefV', 'updateRateHz', 'areaBudgetMm2', 'inlTargetLsb', 'dnlTargetLsb', 'yieldTarget']

/** The first spec fields of a study (engine contract names, SI units). */
export const studySpecDraftSchema = z.object({
  bits: rangedInteger(2, 16),
  vrefV: rangedNumber(0.1, 50, 'V'),
  updateRateHz: rangedNumber(1, 1e10, 'Hz'),
  areaBudgetMm2: rangedNumber(1e-5, 100, 'mm²'),
  inlTargetLsb: rangedNumber(0.01, 64, 'LSB'),
  dnlTargetLsb: rangedNumber(0.01, 0.999, 'LSB'),
  yieldTarget: rangedNumber(0.5, 0.999999)
}, {
  error: iss => iss.code === 'unrecognized_keys'
    ? `is not a spec field (allowed: ${SPEC_FIELDS.join(', ')})`
    : `is required: an object with ${SPEC_FIELDS.join(', ')}`
}).strict()

const TITLE_ERROR = 'is required, 1 to 200 characters'

export const studyCreateSchema = z.object({
  title: z.string({ error: TITLE_ERROR }).trim().min(1, { error: TITLE_ERROR }).max(200, { error: TITLE_ERROR }),
  blockName: z.string({ error: 'must be text of at most 120 characters' }).trim()
    .max(120, { error: 'must be text of at most 120 characters' }).nullish(),
  spec: studySpecDraftSchema
}).strict()

export const studyListQuerySchema = z.object({
  page: rangedInteger(1, 100_000, true).default(1),
  pageSize: rangedInteger(1, 100, true).default(25)
})

export const idParamSchema = z.object({ id: rangedInteger(1, 2 ** 31 - 1, true) })

export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().max(254),
  password: z.string().max(200)
})

export type StudySpecDraft = z.infer<typeof studySpecDraftSchema>
export type StudyCreate = z.infer<typeof studyCreateSchema>
