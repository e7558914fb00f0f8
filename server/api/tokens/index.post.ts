import { tokenCreateSchema } from '#shared/schemas/tokens'
import type { ApiTokenCreatedDto } from '#shared/types/tokens'

/** At most this many unrevoked, unexpired tokens per user. */
const MAX_ACTIVE_TOKENS = 20

/**
 * Creates a personal API token; the answer is the only place the token ever appears (the database
 * keeps its SHA-256). Any role may create one: the role is read again on every use.
 */
export default defineApiHandler(async (event): Promise<ApiTokenCreatedDto> => {
  const user = await requireUser(event)
  refuseApiToken(event)
  const body = await readBodyAs(event, tokenCreateSchema)
  const created = newApiToken()
  const id = await writeTransaction(async (trx) => {
    await trx('users').where({ id: user.id }).forUpdate().first('id')
    const active = await trx('api_tokens').where({ user_id: user.id }).whereNull('revoked_at').where('expires_at', '>', new Date()).count({ n: '*' })
    if (Number(active[0]?.n ?? 0) >= MAX_ACTIVE_TOKENS) {
      const message = `name: you already have ${MAX_ACTIVE_TOKENS} active API tokens; revoke one first`
      throw createError({ statusCode: 409, statusMessage: 'Conflict', message, data: { message } })
    }
    const scopes = scopesText(body.scopes)
    const [tokenId] = await trx('api_tokens').insert({
      user_id: user.id, team_id: user.teamId, name: body.name, prefix: created.prefix, token_hash: created.hash, scopes,
      expires_at: new Date(Date.now() + body.expiresInDays * 86_400_000)
    })
    await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'api_token_created', targetType: 'api_token', targetId: tokenId!, detail: { name: body.name, prefix: created.prefix, scopes, expiresInDays: body.expiresInDays } }, trx)
    return tokenId!
  })
  const row = await userApiTokens(useDb(), user.id).where('k.id', id).first()
  setResponseStatus(event, 201)
  setResponseHeader(event, 'cache-control', 'no-store')
  return { ...toApiTokenDto(row), token: created.token }
})
