import { rulePackDryRunSchema } from '#shared/schemas/rulePacks'
import type { RulePackDryRunDto } from '#shared/types/rulePacks'

/** Runs a draft pack that is not saved yet against a sample; writes nothing. */
export default defineApiHandler(async (event): Promise<RulePackDryRunDto> => {
  const user = await requireUser(event, ...RULE_PACK_WRITER_ROLES)
  const body = await readBodyAs(event, rulePackDryRunSchema)
  if (!body.pack) {
    const message = 'pack: is missing; it must be the rule pack to try'
    throw createError({ statusCode: 400, statusMessage: MESSAGES.invalidInput, message, data: { message, issues: [{ path: 'pack', message: 'is missing; it must be the rule pack to try' }] } })
  }
  return await withHeavySlot(user, 'dry-run', () => dryRunPack(user.teamId, { ...body.pack!, version: 0, source: 'team' }, body))
})
