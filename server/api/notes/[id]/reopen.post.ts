import { idParamSchema } from '#shared/schemas/study'
import type { NoteDto } from '#shared/types/notes'

/** Reopens a resolved thread (any member of the team; only a thread's first note). Repeating it changes nothing. */
export default defineApiHandler(async (event): Promise<NoteDto> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const db = useDb()
  await db.transaction(async (trx) => {
    const note = await teamNote(trx, user, id, true)
    if (note.parent_id !== null) {
      const rule = 'must be the first note of a thread; replies are resolved with their thread'
      throw createError({ statusCode: 400, statusMessage: MESSAGES.invalidInput, message: `id: ${rule}`, data: { message: `id: ${rule}`, issues: [{ path: 'id', message: rule }] } })
    }
    if (note.resolved_at === null) return
    await trx('notes').where({ id }).update({ resolved_at: null, resolved_by: null })
    await auditNote(trx, user, 'note.reopened', note)
  })
  return noteById(db, user.teamId, id)
})
