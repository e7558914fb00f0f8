import { readdir, readFile } from 'node:fs/promises'
import { join } from 'node:path'
import type { CaughtMailDto } from '#shared/types/team'

/** Development only: the messages the local SMTP catcher caught, newest first (admins). */
export default defineApiHandler(async (event): Promise<CaughtMailDto[]> => {
  await requireUser(event, 'admin')
  const { mailCatcherDir } = useRuntimeConfig()
  if (!mailCatcherDir) throw createError({ statusCode: 404, statusMessage: 'No local mail catcher is configured' })
  const names = (await readdir(mailCatcherDir).catch(() => [])).filter(n => n.endsWith('.json')).sort().reverse().slice(0, 50)
  return Promise.all(names.map(async n => JSON.parse(await readFile(join(mailCatcherDir, n), 'utf8')) as CaughtMailDto))
})
