import type { Knex } from 'knex'
import { evaluateInputSchema, type EvaluateOutput } from '#shared/core/contract/evaluate'
import type { RevisionDto, RevisionSummaryDto } from '#shared/types/revisions'
import type { StudyStatus } from '#shared/types/studies'
import { canonicalJson } from '#shared/utils/revisionDiff'

const json = (v: unknown) => typeof v === 'string' ? JSON.parse(v) : v

type RevisionRow = Record<string, unknown> & { number: number, engine_version: string, has_results: number | boolean, note: string | null, author_id: number, author_name: string, created_at: Date }

/** A study's revisions joined with their authors; summaries leave the large results column out. */
export function studyRevisions(db: Knex | Knex.Transaction, studyId: number, full = false) {
  const columns = ['r.number', 'r.engine_version', 'r.note', 'r.author_id', 'u.display_name as author_name', 'r.created_at',
    db.raw('r.results IS NOT NULL as has_results')]
  const query = db('study_revisions as r').join('users as u', 'u.id', 'r.author_id').where('r.study_id', studyId).select(columns)
  return full ? query.select('r.study_id', 'r.spec', 'r.process', 'r.options', 'r.evaluation_id', 'r.results', 'r.weights', 'r.recommendation') : query
}

export function toRevisionSummary(row: RevisionRow): RevisionSummaryDto {
  return {
    number: row.number, engineVersion: row.engine_version, hasResults: Boolean(row.has_results), note: row.note,
    author: { id: row.author_id, name: row.author_name }, createdAt: row.created_at.toISOString()
  }
}

export function toRevisionDto(row: RevisionRow): RevisionDto {
  return {
    ...toRevisionSummary(row), studyId: row.study_id as number, spec: json(row.spec), process: json(row.process), options: json(row.options),
    evaluationId: (row.evaluation_id as number | null) ?? null, results: row.results === null ? null : json(row.results),
    weights: row.weights === null || row.weights === undefined ? null : json(row.weights),
    recommendation: row.recommendation === null || row.recommendation === undefined ? null : json(row.recommendation)
  }
}

/** The team's study (404 otherwise), locked for the rest of the transaction when `lock`. */
export async function teamStudyRow(db: Knex | Knex.Transaction, teamId: number, id: number, lock = false): Promise<{ id: number, version: number, status: StudyStatus, owner_id: number }> {
  const query = db('studies').where({ id, team_id: teamId })
  const row = await (lock ? query.forUpdate() : query).first('id', 'version', 'status', 'owner_id')
  if (!row) throw notFound()
  return row
}

function invalidEvaluation(message: string) {
  const full = `evaluationId: ${message}`
  return createError({ statusCode: 400, statusMessage: MESSAGES.invalidInput, message: full, data: { message: full, issues: [{ path: 'evaluationId', message }] } })
}

/**
 * The results of a finished evaluation of this team, checked to be for exactly these inputs
 * (a revision never pairs inputs with another input's results).
 */
export async function evaluationResults(trx: Knex.Transaction, teamId: number, evaluationId: number, inputs: object): Promise<{ results: EvaluateOutput, engineVersion: string }> {
  const row = await trx('evaluations').where({ id: evaluationId, team_id: teamId }).first('status', 'input', ...EVALUATION_RESULT_COLUMNS, 'engine_version')
  if (!row) throw invalidEvaluation('no such evaluation in your team')
  const results = row.status === 'done' ? evaluationResultOf<EvaluateOutput>(row) : null
  if (!results) throw invalidEvaluation(`must be a finished evaluation (this one is ${row.status})`)
  const input = evaluateInputSchema.safeParse(json(row.input))
  if (!input.success || canonicalJson(input.data) !== canonicalJson(inputs)) {
    throw invalidEvaluation('was computed for other inputs than the ones being saved; run it again')
  }
  return { results, engineVersion: row.engine_version }
}

/** Engineers edit their own studies; architects and admins edit every study of the team. */
export function assertMayEditStudy(user: { id: number, role: string }, study: { owner_id: number }): void {
  if (user.role !== 'engineer' || study.owner_id === user.id) return
  const message = 'Engineers edit their own studies; ask the owner or an architect to save this one, or write a note'
  throw createError({ statusCode: 403, statusMessage: MESSAGES.forbidden, message, data: { message } })
}
