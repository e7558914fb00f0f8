import { z } from 'zod'
import { intInRange, says } from '../core/contract/fields'

const statusVersion = intInRange(0, 2 ** 31 - 1)
const id = intInRange(1, 2 ** 31 - 1)
const requiredText = (max: number) => z.string(says(`is required, 1 to ${max} characters`)).trim()
  .min(1, says(`is required, 1 to ${max} characters`)).max(max, says(`is required, 1 to ${max} characters`))
const optionalText = (max: number) => z.string(says(`must be text of at most ${max} characters`)).trim()
  .max(max, says(`must be text of at most ${max} characters`)).optional()

/** Every status change names the study's `statusVersion` it saw (409 when it is stale). */
export const reviewRequestSchema = z.strictObject({
  statusVersion,
  reviewerIds: z.array(id, says('must be a list of 1 to 10 team member ids')).min(1, says('must name at least one reviewer (1 to 10)')).max(10, says('must name at most 10 reviewers'))
    .refine(ids => new Set(ids).size === ids.length, says('must not name a reviewer twice'))
})

export const REVIEW_VERDICTS = ['signed_off', 'changes_requested'] as const

/** A reviewer's verdict; requesting changes needs a comment that says what to change. */
export const reviewVerdictSchema = z.strictObject({
  statusVersion,
  verdict: z.enum(REVIEW_VERDICTS, says('must be signed_off or changes_requested')),
  comment: optionalText(4000)
}).superRefine((v, ctx) => {
  if (v.verdict === 'changes_requested' && !v.comment) ctx.addIssue({ code: 'custom', path: ['comment'], input: v.comment, message: 'is required when requesting changes, 1 to 4000 characters' })
})

/** A waiver: the failing line it covers (as the study lists it), who accepts it and why. */
export const waiverSchema = z.strictObject({
  line: z.string(says('must name a line the chosen candidate fails, 1 to 120 characters')).trim().min(1, says('must name a line the chosen candidate fails, 1 to 120 characters')).max(120, says('must name a line the chosen candidate fails, 1 to 120 characters')),
  by: requiredText(120),
  reason: requiredText(2000)
})

export const decisionSchema = z.strictObject({
  statusVersion,
  candidateId: z.string(says('must be the id of a candidate in the revision\'s results')).trim().min(1, says('must be the id of a candidate in the revision\'s results')).max(60, says('must be the id of a candidate in the revision\'s results')),
  rationale: requiredText(4000),
  revision: id,
  signOffIds: z.array(id, says('must be a list of 1 to 20 sign-off ids')).min(1, says('must name at least one sign-off on the revision')).max(20, says('must name at most 20 sign-offs')),
  /** one per line the chosen candidate fails (none when it meets every line) */
  waivers: z.array(waiverSchema, says('must be a list of at most 20 waivers')).max(20, says('must be a list of at most 20 waivers')).default([])
})

export const statusChangeSchema = z.strictObject({ statusVersion })

export type ReviewRequest = z.infer<typeof reviewRequestSchema>
export type ReviewVerdict = z.infer<typeof reviewVerdictSchema>
export type DecisionCreate = z.infer<typeof decisionSchema>
export type Waiver = z.infer<typeof waiverSchema>
