import { invitationAcceptSchema, invitationTokenSchema } from '#shared/schemas/team'

/** Public: sets the invited member's password once and activates the account. */
export default defineApiHandler(async (event) => {
  const { token } = paramsAs(event, invitationTokenSchema)
  const { password } = await readBodyAs(event, invitationAcceptSchema)
  await acceptInvitation(token, password)
  setResponseStatus(event, 201)
  return { ok: true }
})
