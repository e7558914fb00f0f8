import { invitationTokenSchema } from '#shared/schemas/team'
import type { InvitationPreviewDto } from '#shared/types/team'

/** Public: what an invitation link is for (the link itself is the credential). */
export default defineApiHandler(async (event): Promise<InvitationPreviewDto> => {
  const { token } = paramsAs(event, invitationTokenSchema)
  return toInvitationPreview(await findInvitation(token))
})
