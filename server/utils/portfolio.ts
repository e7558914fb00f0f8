import type { Knex } from 'knex'
import type { PortfolioQuery } from '#shared/schemas/portfolio'
import type { PortfolioRow } from '#shared/types/portfolio'
import { openNoteThreads } from './noteThreads'

const SORT_COLUMNS = { updated: 's.updated_at', title: 's.title', status: 's.status', area: 's.summary_area_mm2', fails: 's.summary_fail_count' } as const
const NULLABLE_SORTS = new Set<PortfolioQuery['sort']>(['area', 'fails'])

/** The team's studies matching the filters (no paging, no join: every study has an owner). */
export function portfolioBase(db: Knex, teamId: number, q: Pick<PortfolioQuery, 'status' | 'q'>) {
  const query = db('studies as s').where('s.team_id', teamId)
  if (q.status !== 'all') query.where('s.status', q.status)
  if (q.q) {
    const like = `%${q.q.replace(/[\\%_]/g, c => `\\${c}`)}%`
    query.where(w => w.where('s.title', 'like', like).orWhere('s.block_name', 'like', like))
  }
  return query
}

/** Sorted as asked, ties broken by id; studies without results last. */
function sorted<T extends Knex.QueryBuilder>(query: T, q: PortfolioQuery): T {
  // Only the nullable summary columns need the IS NULL term, and only ascending (MariaDB puts
  // NULL last in descending order): without it the sort walks an index.
  if (NULLABLE_SORTS.has(q.sort) && q.dir === 'asc') query.orderByRaw(`${SORT_COLUMNS[q.sort]} IS NULL`)
  return query.orderBy([{ column: SORT_COLUMNS[q.sort], order: q.dir }, { column: 's.id', order: q.dir }]) as T
}

/**
 * One page (or, with `limit`, the first rows). Late row lookup: the page's ids come from an index
 * walk of `studies` alone, then only those rows are read and joined with their owners, so a deep
 * page never reads the skipped rows' specs.
 */
export function portfolioRows(db: Knex, teamId: number, q: PortfolioQuery, limit = q.pageSize, offset = (q.page - 1) * q.pageSize) {
  const page = sorted(portfolioBase(db, teamId, q).select('s.id'), q).limit(limit).offset(offset).as('page')
  return sorted(db.from(page).join('studies as s', 's.id', 'page.id').join('users as u', 'u.id', 's.owner_id')
    .select('s.id', 's.title', 's.block_name', 's.status', 's.spec', 's.version', 's.updated_at', 'u.display_name as owner',
      's.summary_candidate_id', 's.decision_candidate_id', 's.summary_label', 's.summary_area_mm2', 's.summary_fail_count', 's.summary_meeting_count', 's.summary_candidate_count',
      // open notes: threads neither resolved nor deleted (counted for the page's rows only)
      openNoteThreads(db, 'n').whereRaw('n.study_id = s.id').count('*').as('open_notes'),
      // waivers of the decision in force (null without one)
      db('study_decisions as d').whereRaw('d.study_id = s.id').whereNull('d.superseded_at').orderBy('d.id', 'desc').limit(1)
        .select(db.raw('COALESCE(JSON_LENGTH(d.waivers), 0)')).as('waiver_count')), q)
}

/** Database row → the portfolio's shape. */
export function toPortfolioRow(row: Record<string, unknown>): PortfolioRow {
  const spec = (typeof row.spec === 'string' ? JSON.parse(row.spec) : row.spec) as { bits?: number, areaBudgetMm2?: number }
  const evaluated = row.summary_candidate_count !== null
  return {
    id: row.id as number,
    title: row.title as string,
    blockName: row.block_name as string | null,
    status: row.status as PortfolioRow['status'],
    bits: spec.bits ?? null,
    owner: row.owner as string,
    revision: row.version as number,
    recommendedId: row.summary_candidate_id as string | null,
    chosenId: row.decision_candidate_id as string | null,
    label: (row.summary_label as string | null) ?? null,
    waiverCount: row.waiver_count === null || row.waiver_count === undefined ? null : Number(row.waiver_count),
    evaluated,
    areaMm2: row.summary_area_mm2 as number | null,
    areaBudgetMm2: spec.areaBudgetMm2 ?? null,
    failCount: row.summary_fail_count as number | null,
    meetingCount: row.summary_meeting_count as number | null,
    candidateCount: row.summary_candidate_count as number | null,
    openNotes: Number(row.open_notes ?? 0),
    lastActivityAt: (row.updated_at as Date).toISOString()
  }
}
