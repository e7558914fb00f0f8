import { memberUpdateSchema } from '#shared/schemas/team'
import { idParamSchema } from '#shared/schemas/study'
import type { TeamMemberDto } from '#shared/types/team'

/** An admin changes a member's role or access (see updateMember). */
export default defineApiHandler(async (event): Promise<TeamMemberDto> => {
  const admin = await requireUser(event, 'admin')
  const { id } = paramsAs(event, idParamSchema)
  const change = await readBodyAs(event, memberUpdateSchema)
  return updateMember(admin, id, change)
})
