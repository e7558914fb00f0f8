import type { Knex } from 'knex'
import type { NoteAttachmentDto, NoteDto, NoteThreadDto } from '#shared/types/notes'

type Row = NoteRow & { author_name: string, resolved_by_name: string | null, created_at: Date, updated_at: Date }
type Head = Awaited<ReturnType<typeof headMetrics>>

function toNoteDto(row: Row, head: Head, mentions: NoteDto['mentions'], attachments: NoteAttachmentDto[]): NoteDto {
  const deleted = row.deleted_at !== null
  const valueNow = row.anchor_type === 'metric' ? metricValue(head, row.candidate_id, row.metric_key) : null
  // A metric note says "number changed since" when the head revision carries another value.
  const changed = row.anchor_type === 'metric' && head.revision !== row.revision && valueNow !== row.metric_value
  return {
    id: row.id, studyId: row.study_id, parentId: row.parent_id,
    anchor: { type: row.anchor_type, candidateId: row.candidate_id, metricKey: row.metric_key },
    revision: row.revision, valueThen: row.metric_value, valueNow, changed,
    body: deleted ? '' : row.body, bodyHtml: deleted ? '' : row.body_html,
    author: { id: row.author_id, name: row.author_name }, mentions: deleted ? [] : mentions, version: row.version,
    resolved: row.resolved_at ? { at: row.resolved_at.toISOString(), by: row.resolved_by_name } : null,
    deleted, attachments: deleted ? [] : attachments,
    createdAt: row.created_at.toISOString(), updatedAt: row.updated_at.toISOString()
  }
}

/** Attachment metadata (never the bytes) of the given notes. */
async function attachmentsOf(db: Knex, ids: number[]): Promise<Map<number, NoteAttachmentDto[]>> {
  const rows = ids.length ? await db('note_attachments').whereIn('note_id', ids).orderBy('id').select('id', 'note_id', 'filename', 'mime_type', 'size_bytes', 'created_at') : []
  const out = new Map<number, NoteAttachmentDto[]>()
  for (const a of rows) {
    const list = out.get(a.note_id) ?? []
    list.push({ id: a.id, filename: a.filename, mimeType: a.mime_type, sizeBytes: a.size_bytes, url: `/api/attachments/${a.id}`, createdAt: new Date(a.created_at).toISOString() })
    out.set(a.note_id, list)
  }
  return out
}

/**
 * A study's threads, oldest first, with replies, mentions, attachment metadata and the "number
 * changed since" marks. Deleted notes are left out; a deleted first note with live replies stays
 * as an empty placeholder so the replies keep their thread.
 */
export async function studyThreads(db: Knex, teamId: number, studyId: number): Promise<NoteThreadDto[]> {
  const rows: Row[] = await db('notes as n').join('users as u', 'u.id', 'n.author_id').leftJoin('users as r', 'r.id', 'n.resolved_by')
    .where({ 'n.team_id': teamId, 'n.study_id': studyId }).orderBy('n.id')
    .select('n.*', 'u.display_name as author_name', 'r.display_name as resolved_by_name')
  const live = rows.filter(r => r.deleted_at === null)
  const ids = live.map(r => r.id)
  const [head, mentionRows, files] = await Promise.all([
    headMetrics(db, studyId),
    ids.length ? db('note_mentions as m').join('users as u', 'u.id', 'm.user_id').whereIn('m.note_id', ids).select('m.note_id', 'u.id', 'u.display_name') : [],
    attachmentsOf(db, ids)
  ])
  const dto = (r: Row) => toNoteDto(r, head, mentionRows.filter(m => m.note_id === r.id).map(m => ({ id: m.id, name: m.display_name })), files.get(r.id) ?? [])
  const replies = new Map<number, NoteDto[]>()
  for (const r of live) {
    if (r.parent_id === null) continue
    replies.set(r.parent_id, [...(replies.get(r.parent_id) ?? []), dto(r)])
  }
  return rows.filter(r => r.parent_id === null && (r.deleted_at === null || replies.has(r.id)))
    .map(r => ({ ...dto(r), replies: replies.get(r.id) ?? [] }))
}

/** One note as the API returns it after a write. */
export async function noteById(db: Knex, teamId: number, id: number): Promise<NoteDto> {
  const row = await db('notes').where({ id, team_id: teamId }).first('study_id', 'parent_id')
  if (!row) throw notFound()
  const threads = await studyThreads(db, teamId, row.study_id)
  const thread = threads.find(t => t.id === (row.parent_id ?? id))
  const found = row.parent_id === null ? thread : thread?.replies.find(r => r.id === id)
  if (!found) throw notFound()
  if (row.parent_id === null) {
    const { replies: _replies, ...note } = found as NoteThreadDto
    return note
  }
  return found
}
