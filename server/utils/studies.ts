import type { Knex } from 'knex'
import type { StudyDto } from '#shared/types/studies'

interface StudyRow {
  id: number
  title: string
  block_name: string | null
  status: StudyDto['status']
  spec: StudyDto['spec'] | string
  version: number
  status_version: number
  owner_id: number
  owner_name: string
  summary_candidate_id: string | null
  decision_candidate_id: string | null
  created_at: Date
  updated_at: Date
}

const STUDY_COLUMNS = ['s.id', 's.title', 's.block_name', 's.status', 's.spec', 's.version', 's.status_version', 's.owner_id',
  'u.display_name as owner_name', 's.created_at', 's.updated_at', 's.summary_candidate_id', 's.decision_candidate_id']

/** Studies of one team with their owner's name: every study query starts here. */
export function teamStudies(db: Knex | Knex.Transaction, teamId: number) {
  return db('studies as s').join('users as u', 'u.id', 's.owner_id').where('s.team_id', teamId).select(STUDY_COLUMNS)
}

/**
 * One page of the team's studies, newest activity first. Late row lookup: the page's ids come
 * from the (team_id, updated_at) index alone, then only those rows are read (see portfolioRows).
 */
export function teamStudiesPage(db: Knex, teamId: number, limit: number, offset: number) {
  const order = [{ column: 's.updated_at', order: 'desc' }, { column: 's.id', order: 'desc' }]
  const page = db('studies as s').where('s.team_id', teamId).select('s.id').orderBy(order).limit(limit).offset(offset).as('page')
  return db.from(page).join('studies as s', 's.id', 'page.id').join('users as u', 'u.id', 's.owner_id').select(STUDY_COLUMNS).orderBy(order)
}

/** Row → API shape (JSON column parsed if the driver returned text). */
export function toStudyDto(row: StudyRow): StudyDto {
  return {
    id: row.id,
    title: row.title,
    blockName: row.block_name,
    status: row.status,
    spec: typeof row.spec === 'string' ? JSON.parse(row.spec) : row.spec,
    version: row.version,
    statusVersion: row.status_version,
    owner: { id: row.owner_id, name: row.owner_name },
    recommendedId: row.summary_candidate_id ?? null,
    chosenId: row.decision_candidate_id ?? null,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString()
  }
}
