import { idParamSchema } from '#shared/schemas/study'

/**
 * A note's file, for members of its team only (another team's: 404, as for a deleted note). The
 * Content-Type is the type sniffed at upload; images may show in place, everything else downloads;
 * nosniff and a sandboxing CSP keep a browser from treating the bytes as anything else.
 */
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const row = await useDb()('note_attachments as a').join('notes as n', 'n.id', 'a.note_id')
    .where({ 'a.id': id, 'a.team_id': user.teamId }).whereNull('n.deleted_at')
    .first('a.filename', 'a.mime_type', 'a.size_bytes', 'a.sha256', 'a.data')
  if (!row) throw notFound()
  const type = row.mime_type as AttachmentType
  const inline = INLINE_TYPES.includes(type) && getQuery(event).download === undefined
  setResponseHeaders(event, {
    'content-type': type === 'text/csv' ? 'text/csv; charset=utf-8' : type,
    'content-length': row.size_bytes as number,
    'content-disposition': contentDisposition(inline ? 'inline' : 'attachment', row.filename),
    'x-content-type-options': 'nosniff',
    'content-security-policy': 'default-src \'none\'; sandbox',
    'cache-control': 'no-store',
    'etag': `"${row.sha256}"`
  })
  return row.data as Buffer
})
