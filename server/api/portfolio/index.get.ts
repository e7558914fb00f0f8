import { portfolioQuerySchema } from '#shared/schemas/portfolio'
import type { PortfolioPage } from '#shared/types/portfolio'

/** The program manager's view: every study of the team, filtered, sorted and paged on the server. */
export default defineApiHandler(async (event): Promise<PortfolioPage> => {
  const user = await requireUser(event)
  const q = queryAs(event, portfolioQuerySchema)
  const db = useDb()
  const [rows, counts] = await Promise.all([
    portfolioRows(db, user.teamId, q),
    portfolioBase(db, user.teamId, q).count({ total: '*' })
  ])
  return { items: rows.map(toPortfolioRow), page: q.page, pageSize: q.pageSize, total: Number(counts[0]?.total ?? 0) }
})
