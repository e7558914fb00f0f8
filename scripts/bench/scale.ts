/**
 * Section `scale` of `npm run bench`: the study list and the portfolio (filters, sorts, deep
 * pages) on the 10,000-study bench team (scripts/seed-large.ts), 60 sequential requests per
 * route after a warm-up, p95 of the response time on loopback (an upper bound of the server
 * time) against 200 ms. Also EXPLAINs the queries and fails a row whose plan scans the table.
 */
import knex, { type Knex } from 'knex'
import { knexConfig } from '../../server/db/knexfile'
import { portfolioBase, portfolioRows } from '../../server/utils/portfolio'
import { teamStudiesPage } from '../../server/utils/studies'
import { portfolioQuerySchema } from '../../shared/schemas/portfolio'
import { LARGE_PASSWORD, LARGE_USERS, seedLargeTeam } from '../seed-large'
import { benchSignIn, quantile, startBenchDatabase, startServer } from './stack'
import type { BenchRow } from './solve'

export const SCALE_ROUTES = [
  '/api/studies?page=1&pageSize=25',
  '/api/studies?page=300&pageSize=25',
  '/api/portfolio',
  '/api/portfolio?status=in_review&sort=updated&dir=desc',
  '/api/portfolio?sort=area&dir=asc',
  '/api/portfolio?sort=fails&dir=desc&page=40',
  '/api/portfolio?sort=title&dir=asc&page=200',
  '/api/portfolio?sort=status&dir=desc',
  '/api/portfolio?q=channel%2042&sort=updated',
  '/api/portfolio?status=decided&sort=area&dir=desc&pageSize=100'
]
const RUNS = 60

async function timeRoute(url: string, cookie: string): Promise<number[]> {
  const times: number[] = []
  for (let i = 0; i < RUNS + 5; i++) {
    const t0 = performance.now()
    const res = await fetch(url, { headers: { cookie, accept: 'application/json' } })
    await res.text()
    if (res.status !== 200) throw new Error(`${url} answered ${res.status}`)
    if (i >= 5) times.push(performance.now() - t0)
  }
  return times.sort((a, b) => a - b)
}

type Plan = { table: string, type: string, key: string | null, rows: number, Extra: string | null }

/** EXPLAIN of what the routes run: the key used for `studies` (null = full scan). */
async function explainRoutes(databaseUrl: string, teamId: number): Promise<{ name: string, plan: Plan[] }[]> {
  const db = knex(knexConfig(databaseUrl))
  try {
    const queries: { name: string, sql: { sql: string, bindings: readonly unknown[] } }[] = [
      { name: 'studies list page', sql: teamStudiesPage(db, teamId, 25, 7475).toSQL() }
    ]
    for (const path of SCALE_ROUTES.filter(r => r.startsWith('/api/portfolio'))) {
      const q = portfolioQuerySchema.parse(Object.fromEntries(new URL(path, 'http://x').searchParams))
      queries.push({ name: `portfolio rows ${path}`, sql: portfolioRows(db, teamId, q).toSQL() })
      queries.push({ name: `portfolio count ${path}`, sql: portfolioBase(db, teamId, q).count({ total: '*' }).toSQL() })
    }
    const out = []
    for (const q of queries) {
      const [rows] = await db.raw(`EXPLAIN ${q.sql.sql}`, q.sql.bindings as Knex.RawBinding[])
      out.push({ name: q.name, plan: rows as Plan[] })
    }
    return out
  } finally {
    await db.destroy()
  }
}

export async function runScaleBench(): Promise<BenchRow[]> {
  const stack = await startBenchDatabase()
  try {
    const db = knex(knexConfig(stack.db.url))
    const seeded = await seedLargeTeam(db, { log: line => process.stdout.write(`[scale] ${line}\n`) }).finally(() => db.destroy())
    const server = await startServer(stack)
    const cookie = await benchSignIn(server.url, LARGE_USERS[3].email, LARGE_PASSWORD)
    const rows: BenchRow[] = [
      { name: `seed ${seeded.studies} studies with revisions`, value: seeded.studiesSeconds, unit: 's', target: '< 60 s', pass: seeded.studiesSeconds < 60 }
    ]
    for (const route of SCALE_ROUTES) {
      const p95 = quantile(await timeRoute(`${server.url}${route}`, cookie), 0.95)
      rows.push({ name: `GET ${route}, p95 of ${RUNS}`, value: p95, unit: 'ms', target: '< 200 ms', pass: p95 < 200 })
    }
    for (const e of await explainRoutes(stack.db.url, seeded.teamId)) {
      const studies = e.plan.filter(p => p.table === 's')
      const line = e.plan.map(p => `${p.table}:${p.type}/${p.key ?? 'no key'}/${p.rows} rows${p.Extra ? ` (${p.Extra})` : ''}`).join('; ')
      process.stdout.write(`[scale] EXPLAIN ${e.name}: ${line}\n`)
      // A substring search (LIKE '%…%') reads each of the team's rows whatever the index; its
      // time is what the row above checks, so its plan is shown, not scored.
      if (e.name.includes('q=')) continue
      rows.push({ name: `EXPLAIN ${e.name}: studies read through an index`, value: studies.filter(p => p.key && p.type !== 'ALL').length, unit: `of ${studies.length}`, target: 'every read of studies by an index', pass: studies.length > 0 && studies.every(p => p.key && p.type !== 'ALL') })
    }
    return rows
  } finally {
    await stack.stop()
  }
}
