import { invitationCreateSchema } from '#shared/schemas/team'

/** An admin invites a new member; the e-mail goes out through the outbox. */
export default defineApiHandler(async (event) => {
  const admin = await requireUser(event, 'admin')
  const body = await readBodyAs(event, invitationCreateSchema)
  const id = await inviteMember(admin, body)
  setResponseStatus(event, 201)
  return { id }
})
