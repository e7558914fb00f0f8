import type { Knex } from 'knex'
import type { NoteAnchor } from '#shared/schemas/notes'
import type { SessionUser } from '#shared/types/auth'
import { mentionMail } from '../mail/templates'

type Db = Knex | Knex.Transaction

export interface NoteRow {
  id: number
  team_id: number
  study_id: number
  parent_id: number | null
  anchor_type: NoteAnchor['type']
  candidate_id: string | null
  metric_key: string | null
  revision: number
  metric_value: number | null
  body: string
  body_html: string
  author_id: number
  version: number
  resolved_at: Date | null
  deleted_at: Date | null
}

/** A note of the user's team (404 otherwise, also when deleted), locked when `lock`. */
export async function teamNote(db: Db, user: SessionUser, id: number, lock = false): Promise<NoteRow> {
  const query = db('notes').where({ id, team_id: user.teamId }).whereNull('deleted_at')
  const row = await (lock ? query.forUpdate() : query).first()
  if (!row) throw notFound()
  return row
}

/** Only the author or an admin changes or deletes a note. */
export function requireNoteWriter(user: SessionUser, note: Pick<NoteRow, 'author_id'>): void {
  if (note.author_id !== user.id && user.role !== 'admin') {
    throw createError({ statusCode: 403, statusMessage: MESSAGES.forbidden, message: 'Only the note\'s author or an admin may change or delete it' })
  }
}

/** Candidate ids and their metrics in the study's head revision (none before results are saved). */
export async function headMetrics(db: Db, studyId: number): Promise<{ revision: number, metrics: Map<string, Record<string, unknown>> }> {
  const row = await db('studies as s').leftJoin('study_revisions as r', q => q.on('r.study_id', 's.id').andOn('r.number', 's.version'))
    .where('s.id', studyId)
    .first('s.version', db.raw('JSON_EXTRACT(r.results, \'$.candidates[*].id\') as ids'), db.raw('JSON_EXTRACT(r.results, \'$.candidates[*].metrics\') as metrics'))
  const parse = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v) as unknown[] | null
  const ids = parse(row?.ids) ?? []
  const metrics = parse(row?.metrics) ?? []
  return { revision: row?.version ?? 0, metrics: new Map(ids.map((id, i) => [String(id), (metrics[i] ?? {}) as Record<string, unknown>])) }
}

export function metricValue(head: Awaited<ReturnType<typeof headMetrics>>, candidateId: string | null, key: string | null): number | null {
  if (!candidateId || !key) return null
  const v = head.metrics.get(candidateId)?.[key]
  return typeof v === 'number' && Number.isFinite(v) ? v : null
}

/** Active members of the team named in the body, without the author. */
export async function mentionedMembers(db: Db, user: SessionUser, body: string): Promise<{ id: number, email: string, display_name: string }[]> {
  const handles = mentionHandles(body)
  if (!handles.length) return []
  const members = await db('users').where({ team_id: user.teamId, active: true }).select('id', 'email', 'display_name')
  const ids = resolveMentions(handles, members)
  return members.filter(m => ids.includes(m.id) && m.id !== user.id)
}

const ANCHOR_WORDS = { study: 'the study', candidate: 'candidate', metric: 'metric' } as const

/**
 * Records the note's mentions and queues one e-mail to each member it mentions for the first
 * time (an edit that keeps a mention mails nobody again), in the caller's transaction.
 */
export async function mentionAndMail(trx: Knex.Transaction, user: SessionUser, note: Pick<NoteRow, 'id' | 'study_id' | 'anchor_type' | 'candidate_id' | 'metric_key' | 'body'>): Promise<number[]> {
  const members = await mentionedMembers(trx, user, note.body)
  const already = new Set((await trx('note_mentions').where({ note_id: note.id }).pluck('user_id')) as number[])
  const fresh = members.filter(m => !already.has(m.id))
  if (!fresh.length) return []
  await trx('note_mentions').insert(fresh.map(m => ({ note_id: note.id, user_id: m.id })))
  const study = await trx('studies').where({ id: note.study_id }).first('title')
  const { appUrl } = useRuntimeConfig()
  const about = note.anchor_type === 'study' ? ANCHOR_WORDS.study : note.anchor_type === 'candidate' ? `candidate ${note.candidate_id}` : `${note.metric_key} of candidate ${note.candidate_id}`
  for (const m of fresh) {
    const mail = mentionMail({ recipientName: m.display_name, authorName: user.name, studyTitle: study?.title ?? 'a study', about, excerpt: note.body, url: `${appUrl.replace(/\/$/, '')}/studies/${note.study_id}#note-${note.id}` })
    await queueMail(trx, { ...mail, teamId: user.teamId, to: m.email, template: 'mention' })
  }
  return fresh.map(m => m.id)
}

/** The audit row of a note action, keyed by the study so its activity history can read it. */
export function auditNote(trx: Knex.Transaction, user: SessionUser, action: string, note: Pick<NoteRow, 'id' | 'study_id' | 'parent_id'>, detail: Record<string, unknown> = {}) {
  return writeAudit({ teamId: user.teamId, actorId: user.id, action, targetType: 'study', targetId: note.study_id, detail: { noteId: note.id, parentId: note.parent_id, ...detail } }, trx)
}
