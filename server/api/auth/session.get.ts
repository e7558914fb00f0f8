import type { SessionUser } from '#shared/types/auth'

export default defineApiHandler(async (event): Promise<SessionUser> => {
  return await requireUser(event)
})
