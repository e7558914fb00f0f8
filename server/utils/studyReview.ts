import type { Knex } from 'knex'
import type { SessionUser } from '#shared/types/auth'
import type { DecisionDto, PersonDto, ReviewEntryDto, ReviewStateDto, WaiverDto } from '#shared/types/review'
import type { StudyStatus } from '#shared/types/studies'

type Db = Knex | Knex.Transaction
const json = (v: unknown) => typeof v === 'string' ? JSON.parse(v) : v

export interface StatusRow { id: number, team_id: number, owner_id: number, title: string, status: StudyStatus, status_version: number, version: number }

export const STATUS_WORDS: Record<StudyStatus, string> = { draft: 'Draft', in_review: 'In review', decided: 'Decided', archived: 'Archived' }

/** A study of the caller's team (404 otherwise), locked, at the status version the caller saw (409 otherwise). */
export async function lockStudyStatus(trx: Knex.Transaction, user: SessionUser, id: number, statusVersion: number): Promise<StatusRow> {
  const row = await trx('studies').where({ id, team_id: user.teamId }).forUpdate()
    .first('id', 'team_id', 'owner_id', 'title', 'status', 'status_version', 'version') as StatusRow | undefined
  if (!row) throw notFound()
  if (row.status_version !== statusVersion) {
    const message = `statusVersion: the study's status was changed by someone else (you saw ${statusVersion}, the current one is ${row.status_version}); reload it and try again`
    throw createError({ statusCode: 409, statusMessage: 'Conflict', message, data: { message, currentStatusVersion: row.status_version } })
  }
  return row
}

/** 409 when the study is not in one of the states the step starts from. */
export function requireStatus(row: StatusRow, step: string, ...allowed: StudyStatus[]): void {
  if (allowed.includes(row.status)) return
  const message = `status: ${step} needs a study that is ${allowed.map(s => STATUS_WORDS[s]).join(' or ')}; this one is ${STATUS_WORDS[row.status]}`
  throw createError({ statusCode: 409, statusMessage: 'Conflict', message, data: { message } })
}

export function refuse(message: string) {
  return createError({ statusCode: 403, statusMessage: MESSAGES.forbidden, message, data: { message } })
}

export function invalidField(path: string, message: string) {
  const full = `${path}: ${message}`
  return createError({ statusCode: 400, statusMessage: MESSAGES.invalidInput, message: full, data: { message: full, issues: [{ path, message }] } })
}

/** Decided and archived studies are read-only (notes stay open): 423 for every edit. */
export function assertEditable(status: StudyStatus): void {
  if (status !== 'decided' && status !== 'archived') return
  const message = status === 'decided'
    ? 'This study is decided and read-only; an architect or admin can reopen it to edit (notes stay open)'
    : 'This study is archived and read-only'
  throw createError({ statusCode: 423, statusMessage: 'Locked', message, data: { message } })
}

export async function currentRound(db: Db, studyId: number): Promise<number> {
  const row = await db('study_reviews').where({ study_id: studyId }).max({ round: 'round' }).first()
  return Number(row?.round ?? 0)
}

/** The reviewers named in the latest review request. */
export async function roundReviewers(db: Db, studyId: number, round: number): Promise<(PersonDto & { email: string })[]> {
  const rows = await db('study_reviews as r').join('users as u', 'u.id', 'r.reviewer_id')
    .where({ 'r.study_id': studyId, 'r.round': round, 'r.kind': 'assigned' }).orderBy('u.display_name')
    .select('u.id', 'u.display_name as name', 'u.email')
  return rows
}

/** Team architects other than the owner: who may be asked to review. */
export async function eligibleReviewers(db: Db, teamId: number, ownerId: number): Promise<(PersonDto & { email: string })[]> {
  return db('users').where({ team_id: teamId, role: 'architect', active: true }).whereNot('id', ownerId)
    .orderBy('display_name').select('id', 'display_name as name', 'email')
}

export async function reviewEntries(db: Db, studyId: number): Promise<ReviewEntryDto[]> {
  const rows = await db('study_reviews as r').join('users as u', 'u.id', 'r.reviewer_id').join('users as b', 'b.id', 'r.created_by')
    .where('r.study_id', studyId).orderBy('r.id')
    .select('r.id', 'r.round', 'r.kind', 'r.reviewer_id', 'u.display_name as reviewer_name', 'r.revision_number', 'r.comment', 'r.created_by', 'b.display_name as by_name', 'r.created_at')
  return rows.map(r => ({
    id: r.id, round: r.round, kind: r.kind, reviewer: { id: r.reviewer_id, name: r.reviewer_name }, revision: r.revision_number,
    comment: r.comment, by: { id: r.created_by, name: r.by_name }, createdAt: new Date(r.created_at).toISOString()
  }))
}

export async function studyDecisions(db: Db, studyId: number): Promise<DecisionDto[]> {
  const rows = await db('study_decisions as d').join('users as u', 'u.id', 'd.decided_by').where('d.study_id', studyId).orderBy('d.id', 'desc')
    .select('d.id', 'd.candidate_id', 'd.rationale', 'd.revision_number', 'd.sign_off_ids', 'd.waivers', 'd.decided_by', 'u.display_name as decided_by_name', 'd.created_at', 'd.superseded_at')
  return rows.map(d => ({
    id: d.id, candidateId: d.candidate_id, rationale: d.rationale, revision: d.revision_number, signOffIds: json(d.sign_off_ids) as number[], waivers: (d.waivers ? json(d.waivers) : []) as WaiverDto[],
    decidedBy: { id: d.decided_by, name: d.decided_by_name }, createdAt: new Date(d.created_at).toISOString(),
    supersededAt: d.superseded_at ? new Date(d.superseded_at).toISOString() : null
  }))
}

/** Everything the review panel shows, for a study of the caller's team (404 otherwise). */
export async function reviewState(db: Knex, user: SessionUser, id: number): Promise<ReviewStateDto> {
  const row = await db('studies').where({ id, team_id: user.teamId }).first('id', 'owner_id', 'status', 'status_version', 'version')
  if (!row) throw notFound()
  const round = await currentRound(db, id)
  const [reviewers, entries, decisions, eligible] = await Promise.all([
    roundReviewers(db, id, round), reviewEntries(db, id), studyDecisions(db, id), eligibleReviewers(db, user.teamId, row.owner_id)
  ])
  const person = (p: PersonDto) => ({ id: p.id, name: p.name })
  return {
    status: row.status, statusVersion: row.status_version, version: row.version, round,
    reviewers: reviewers.map(person), entries, decisions, eligibleReviewers: eligible.map(person)
  }
}

/** The link a mail carries: the study page, or its brief. */
export function studyUrl(id: number, brief = false): string {
  return `${useRuntimeConfig().appUrl.replace(/\/$/, '')}/${brief ? 'briefs' : 'studies'}/${id}`
}
