import { stringify } from 'csv-stringify/sync'
import { portfolioQuerySchema } from '#shared/schemas/portfolio'

/** At most this many studies go into one export. */
const MAX_EXPORT_ROWS = 10_000

/** The portfolio as CSV: the same filters and order as the table, every page (new columns go at the end). */
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const q = queryAs(event, portfolioQuerySchema)
  const rows = (await portfolioRows(useDb(), user.teamId, q, MAX_EXPORT_ROWS, 0)).map(toPortfolioRow)
  const header = ['id', 'title', 'block', 'status', 'bits', 'owner', 'revision', 'recommended', 'area_mm2', 'area_budget_mm2', 'failing_findings', 'candidates_meeting_spec', 'candidates', 'open_notes', 'last_activity_utc', 'chosen', 'option', 'waivers']
  const body = rows.map(r => [r.id, r.title, r.blockName, r.status, r.bits, r.owner, r.revision, r.recommendedId, r.areaMm2, r.areaBudgetMm2, r.failCount, r.meetingCount, r.candidateCount, r.openNotes, r.lastActivityAt, r.chosenId, r.label, r.waiverCount].map(csvCell))
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="rungwise-portfolio-${new Date().toISOString().slice(0, 10)}.csv"`)
  return stringify([header, ...body])
})
