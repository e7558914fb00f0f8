import { createHash } from 'node:crypto'
import { idParamSchema } from '#shared/schemas/study'
import type { NoteAttachmentDto } from '#shared/types/notes'

const MAX_MB = ATTACHMENT_MAX_BYTES / 1024 / 1024

/**
 * Adds one file (multipart field `file`) to a note: its author or an admin. The size is judged
 * from Content-Length before the body is read (413), the type from the content (415); the bytes
 * and their metadata are written in one transaction with the audit row.
 */
export default defineApiHandler(async (event): Promise<NoteAttachmentDto> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const db = useDb()
  requireNoteWriter(user, await teamNote(db, user, id))
  const length = Number(getRequestHeader(event, 'content-length'))
  if (!Number.isFinite(length) || length <= 0) {
    throw createError({ statusCode: 411, statusMessage: 'Length Required', message: 'file: send the upload with a Content-Length header' })
  }
  if (length > ATTACHMENT_MAX_BYTES + MULTIPART_OVERHEAD_BYTES) throw attachmentError(413, `must be at most ${MAX_MB} MB`)
  if (!getRequestHeader(event, 'content-type')?.startsWith('multipart/form-data')) {
    throw attachmentError(415, 'send it as multipart/form-data with the file in the field "file"')
  }
  let parts: Awaited<ReturnType<typeof readMultipartFormData>>
  try {
    parts = await readMultipartFormData(event)
  } catch {
    throw attachmentError(400, 'the multipart body could not be read')
  }
  const files = (parts ?? []).filter(p => p.name === 'file' && p.filename !== undefined)
  if (files.length !== 1) throw attachmentError(400, 'is missing; send exactly one file in the field "file"')
  const file = files[0]!
  if (file.data.length === 0) throw attachmentError(400, 'is empty')
  if (file.data.length > ATTACHMENT_MAX_BYTES) throw attachmentError(413, `must be at most ${MAX_MB} MB (got ${(file.data.length / 1024 / 1024).toFixed(1)} MB)`)
  const type = await sniffAttachment(file.data)
  const filename = safeFilename(file.filename, type)
  const attachmentId = await db.transaction(async (trx) => {
    const note = await teamNote(trx, user, id, true)
    const [attachment] = await trx('note_attachments').insert({
      team_id: user.teamId, note_id: id, filename, mime_type: type, size_bytes: file.data.length,
      sha256: createHash('sha256').update(file.data).digest('hex'), data: file.data, uploaded_by: user.id
    })
    await auditNote(trx, user, 'attachment.added', note, { attachmentId: attachment, filename, mimeType: type, sizeBytes: file.data.length })
    return attachment!
  })
  setResponseStatus(event, 201)
  return { id: attachmentId, filename, mimeType: type, sizeBytes: file.data.length, url: `/api/attachments/${attachmentId}`, createdAt: new Date().toISOString() }
})
