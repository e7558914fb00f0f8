import type { CaughtMailDto } from '#shared/types/team'

/**
 * Development only: the messages the local SMTP catcher caught for the reader's team, newest
 * first (admins); another team's mail is never listed, and invitation links show no token.
 */
export default defineApiHandler(async (event): Promise<CaughtMailDto[]> => {
  const user = await requireUser(event, 'admin')
  const { mailCatcherDir } = useRuntimeConfig()
  if (!mailCatcherDir) throw createError({ statusCode: 404, statusMessage: 'No local mail catcher is configured' })
  return await caughtMailForTeam(user, mailCatcherDir)
})
