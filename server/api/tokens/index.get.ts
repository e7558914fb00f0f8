import type { ApiTokenDto } from '#shared/types/tokens'

/** The signed-in user's own API tokens (active, expired and revoked); never the tokens themselves. */
export default defineApiHandler(async (event): Promise<ApiTokenDto[]> => {
  const user = await requireUser(event)
  refuseApiToken(event)
  return (await userApiTokens(useDb(), user.id)).map(toApiTokenDto)
})
