import type { Knex } from 'knex'
import type { ImportPreview } from '#shared/io/specImport'
import { portfolioSummary } from '#shared/utils/portfolio'
import type { BenchMeasurementDto } from '#shared/types/bench'
import type { RevisionDto } from '#shared/types/revisions'

/** A 400 for an import with bad rows: the first problems in the message, every row's issues in `data.rows`;
 * `data.issues` names the field (`text`, the file) as every 400 does. */
export function importRefused(preview: ImportPreview) {
  const bad = [
    ...preview.fileIssues.map(i => `${i.path}: ${i.message}`),
    ...preview.rows.filter(r => r.issues.length).map(r => `line ${r.line}: ${r.issues[0]!.path}: ${r.issues[0]!.message}`)
  ]
  const count = preview.rows.filter(r => r.issues.length).length
  const message = `text: ${count > 0 ? `${count} of ${preview.rows.length} rows have problems; nothing was created. ` : ''}${bad.slice(0, 3).join('; ')}`
  return createError({ statusCode: 400, statusMessage: MESSAGES.invalidInput, message, data: { message, issues: [{ path: 'text', message: bad[0] ?? 'has problems' }], fileIssues: preview.fileIssues, rows: preview.rows.map(r => ({ line: r.line, title: r.title, issues: r.issues })) } })
}

/** The team's study and its head revision (null before the first); 404 for another team's study. */
export async function studyWithHead(db: Knex, teamId: number, id: number): Promise<{ study: ReturnType<typeof toStudyDto>, head: RevisionDto | null }> {
  const row = await teamStudies(db, teamId).where('s.id', id).first()
  if (!row) throw notFound()
  const study = toStudyDto(row)
  const headRow = study.version > 0 ? await studyRevisions(db, id, true).where('r.number', study.version).first() : null
  return { study, head: headRow ? toRevisionDto(headRow) : null }
}

/** A 409 naming what the study lacks for this download. */
export function studyNotReady(message: string) {
  return createError({ statusCode: 409, statusMessage: 'Conflict', message, data: { message } })
}

/** A download's headers: type and a safe attachment name. */
export function sendAttachment(event: Parameters<typeof setResponseHeader>[0], type: string, name: string): void {
  const safe = name.replace(/[^\w.-]+/g, '-').replace(/-+/g, '-').slice(0, 120)
  setResponseHeader(event, 'content-type', type)
  setResponseHeader(event, 'content-disposition', `attachment; filename="${safe}"`)
  setResponseHeader(event, 'x-content-type-options', 'nosniff')
}

/** The portfolio columns of a study whose head revision carries these results. */
export function summaryColumns(results: Parameters<typeof portfolioSummary>[0]) {
  const s = portfolioSummary(results)
  return { summary_candidate_id: s.candidateId, summary_area_mm2: s.areaMm2, summary_fail_count: s.failCount, summary_meeting_count: s.meetingCount, summary_candidate_count: s.candidateCount }
}

type BenchRow = Record<string, unknown> & { id: number, study_id: number, candidate_id: string, revision_number: number, file_name: string, quantity: 'voltage' | 'current', bits: number, summary: unknown, uploaded_by: number, uploader_name: string, created_at: Date }

/** A study's bench measurements with their uploaders' names (the points only when `withPoints`). */
export function benchRows(db: Knex, studyId: number, withPoints = false) {
  const q = db('bench_measurements as b').join('users as u', 'u.id', 'b.uploaded_by').where('b.study_id', studyId)
    .select('b.id', 'b.study_id', 'b.candidate_id', 'b.revision_number', 'b.file_name', 'b.quantity', 'b.bits', 'b.summary', 'b.uploaded_by', 'u.display_name as uploader_name', 'b.created_at')
  return withPoints ? q.select('b.points') : q
}

export function toBenchDto(row: BenchRow): BenchMeasurementDto {
  return {
    id: row.id, studyId: row.study_id, candidateId: row.candidate_id, revisionNumber: row.revision_number, fileName: row.file_name,
    quantity: row.quantity, bits: row.bits, summary: typeof row.summary === 'string' ? JSON.parse(row.summary) : row.summary,
    uploadedBy: { id: row.uploaded_by, name: row.uploader_name }, createdAt: row.created_at.toISOString()
  }
}
