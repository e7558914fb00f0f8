import { notePatchSchema } from '#shared/schemas/notes'
import { idParamSchema } from '#shared/schemas/study'
import type { NoteDto } from '#shared/types/notes'

/**
 * Edits a note's text (its author or an admin), naming the version edited: 409 with
 * `data.currentVersion` when someone saved first. Only members it newly mentions get an e-mail.
 */
export default defineApiHandler(async (event): Promise<NoteDto> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const body = await readBodyAs(event, notePatchSchema)
  const db = useDb()
  await db.transaction(async (trx) => {
    const note = await teamNote(trx, user, id, true)
    requireNoteWriter(user, note)
    if (note.version !== body.version) {
      throw conflict(`version: this note was changed by someone else (you edited version ${body.version}, the current one is ${note.version}); reload it and apply your changes again`, note.version)
    }
    await trx('notes').where({ id }).update({ body: body.body, body_html: renderNoteMarkdown(body.body), version: note.version + 1, updated_at: trx.fn.now() })
    const mentioned = await mentionAndMail(trx, user, { ...note, body: body.body })
    await auditNote(trx, user, 'note.edited', note, { version: note.version + 1, mentioned })
  })
  return noteById(db, user.teamId, id)
})
