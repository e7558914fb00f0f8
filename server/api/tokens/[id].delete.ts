import { idParamSchema } from '#shared/schemas/study'
import type { ApiTokenDto } from '#shared/types/tokens'

/** Revokes one of the user's own tokens (404 for anyone else's); it fails from the next request on. */
export default defineApiHandler(async (event): Promise<ApiTokenDto> => {
  const user = await requireUser(event)
  refuseApiToken(event)
  const { id } = paramsAs(event, idParamSchema)
  await writeTransaction(async (trx) => {
    const row = await trx('api_tokens').where({ id, user_id: user.id }).forUpdate().first('name', 'prefix', 'revoked_at')
    if (!row) throw notFound()
    if (row.revoked_at) return
    await trx('api_tokens').where({ id }).update({ revoked_at: new Date() })
    await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'api_token_revoked', targetType: 'api_token', targetId: id, detail: { name: row.name, prefix: row.prefix } }, trx)
  })
  return toApiTokenDto(await userApiTokens(useDb(), user.id).where('k.id', id).first())
})
