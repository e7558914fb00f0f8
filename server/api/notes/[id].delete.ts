import { idParamSchema } from '#shared/schemas/study'

/** Deletes a note softly (its author or an admin): the row keeps who and when, the audit log too. */
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  await useDb().transaction(async (trx) => {
    const note = await teamNote(trx, user, id, true)
    requireNoteWriter(user, note)
    await trx('notes').where({ id }).update({ deleted_at: trx.fn.now(), deleted_by: user.id })
    await auditNote(trx, user, 'note.deleted', note, { authorId: note.author_id })
  })
  setResponseStatus(event, 204)
  return null
})
