/**
 * Inputs of the rule-pack routes and the pack editor. A team pack's JSON is checked with the
 * findings pack schema; each issue keeps its path and names the rule it sits in.
 */
import { z } from 'zod'
import { evaluateInputSchema } from '../core/contract/evaluate'
import { BUILT_IN_PACK_IDS } from '../findings/registry'
import type { RulePackDocument } from '../findings/schema'
import { checkRulePack } from '../findings/validate'

/** A team pack document; messages read `rule "x": …` for issues inside a rule. */
export const teamPackDocumentSchema = z.unknown().transform((raw, ctx): RulePackDocument => {
  const check = checkRulePack(raw)
  if (!check.ok) {
    for (const i of check.issues) {
      ctx.addIssue({ code: 'custom', path: i.segments, message: i.ruleId ? `rule "${i.ruleId}": ${i.message}` : i.message })
    }
    return z.NEVER
  }
  if (BUILT_IN_PACK_IDS.includes(check.pack.id)) {
    ctx.addIssue({ code: 'custom', path: ['id'], message: `must not be ${check.pack.id}, the id of a built-in pack` })
    return z.NEVER
  }
  return check.pack
})

const enabled = z.boolean({ error: 'must be true or false' })
const version = z.number({ error: 'must be the integer version you edited (1 or more)' }).int({ error: 'must be the integer version you edited (1 or more)' }).min(1, { error: 'must be the integer version you edited (1 or more)' })

export const rulePackCreateSchema = z.strictObject({ pack: teamPackDocumentSchema, enabled: enabled.default(false) })

export const rulePackPatchSchema = z.strictObject({ version, pack: teamPackDocumentSchema.optional(), enabled: enabled.optional() })
  .refine(b => b.pack !== undefined || b.enabled !== undefined, { message: 'must change pack or enabled', path: ['pack'] })

export const rulePackDryRunSchema = z.strictObject({
  pack: teamPackDocumentSchema.optional(),
  input: evaluateInputSchema.optional(),
  evaluationId: z.number({ error: 'must be the id of one of your team\'s finished evaluations' }).int({ error: 'must be an integer id' }).min(1, { error: 'must be an integer id' }).optional()
}).refine(b => !(b.input && b.evaluationId), { message: 'give either input or evaluationId, not both', path: ['evaluationId'] })

export type RulePackCreate = z.infer<typeof rulePackCreateSchema>
export type RulePackPatch = z.infer<typeof rulePackPatchSchema>
export type RulePackDryRun = z.infer<typeof rulePackDryRunSchema>
