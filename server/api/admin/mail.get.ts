import { readdir, readFile } from 'node:fs/promises'
import { join } from 'node:path'
import type { CaughtMailDto } from '#shared/types/team'

/** Development only: the messages the local SMTP catcher caught, newest first (admins). */
export default defineApiHandler(async (event): Promise<CaughtMailDto[]> => {
  await requireUser(event, 'admin')
  const { mailCatcherDir } = useRuntimeConfig()
  if (!mailCatcherDir) throw createError({ statusCode: 404, statusMessage: 'No local mail catcher is configured' })
  const names = (await readdir(mailCatcherDir).catch(() => [])).filter(n => n.endsWith('.json')).sort().reverse().slice(0, 50)
  // A file removed or rewritten while we read it is skipped, not a 500.
  const read = await Promise.all(names.map(n => readFile(join(mailCatcherDir, n), 'utf8').then(t => JSON.parse(t) as CaughtMailDto, () => null)))
  return read.filter((m): m is CaughtMailDto => m !== null)
})
