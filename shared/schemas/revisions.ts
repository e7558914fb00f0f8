import { z } from 'zod'
import { rangedInteger } from './study'
import { evaluateInputSchema, maxTrialsFor } from '../core/contract/evaluate'
import { intInRange, says } from '../core/contract/fields'
import { rankingWeightsSchema } from '../findings/weights'

const inputShape = evaluateInputSchema.shape

/**
 * Body of `POST /api/studies/[id]/revisions`: the study's version the client edited (`baseVersion`,
 * 0 before the first revision), the engine's spec, process and options, and optionally the
 * finished evaluation whose results the revision keeps, and the ranking weights the study is judged
 * with (`weights`, every criterion 0 to 10; left out = the defaults).
 */
export const revisionCreateSchema = z.strictObject({
  baseVersion: intInRange(0, 2 ** 31 - 1),
  spec: inputShape.spec,
  process: inputShape.process,
  options: inputShape.options,
  evaluationId: intInRange(1, 2 ** 31 - 1).optional(),
  weights: rankingWeightsSchema.optional(),
  note: z.string(says('must be text of at most 500 characters')).trim().max(500, says('must be text of at most 500 characters')).optional()
}).superRefine((v, ctx) => {
  // The same bound as the evaluate contract: Monte Carlo work per request stays limited.
  const cap = maxTrialsFor(v.spec.bits)
  if (v.options.trials > cap) {
    ctx.addIssue({ code: 'custom', path: ['options', 'trials'], input: v.options.trials, message: `must be an integer from 0 to ${cap} for ${v.spec.bits}-bit specs (got ${v.options.trials})` })
  }
})

export const revisionParamsSchema = z.object({
  id: rangedInteger(1, 2 ** 31 - 1, true),
  n: rangedInteger(1, 2 ** 31 - 1, true)
})

export const revisionCompareQuerySchema = z.object({
  from: rangedInteger(1, 2 ** 31 - 1, true),
  to: rangedInteger(1, 2 ** 31 - 1, true)
})

export type RevisionCreate = z.infer<typeof revisionCreateSchema>
