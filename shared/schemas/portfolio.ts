import { z } from 'zod'
import { STUDY_STATUSES } from '../types/studies'
import { rangedInteger } from './study'

export const PORTFOLIO_SORTS = ['updated', 'title', 'status', 'area', 'fails'] as const

export const portfolioQuerySchema = z.object({
  page: rangedInteger(1, 100_000, true).default(1),
  pageSize: rangedInteger(1, 100, true).default(25),
  status: z.enum(['all', ...STUDY_STATUSES], { error: `must be one of all, ${STUDY_STATUSES.join(', ')}` }).default('all'),
  q: z.string({ error: 'must be text of at most 100 characters' }).trim().max(100, { error: 'must be text of at most 100 characters' }).default(''),
  sort: z.enum(PORTFOLIO_SORTS, { error: `must be one of ${PORTFOLIO_SORTS.join(', ')}` }).default('updated'),
  dir: z.enum(['asc', 'desc'], { error: 'must be asc or desc' }).default('desc')
})

export type PortfolioQuery = z.infer<typeof portfolioQuerySchema>
export type PortfolioSort = typeof PORTFOLIO_SORTS[number]
