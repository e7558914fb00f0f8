import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PortfolioPage } from '../../shared/types/portfolio'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'

const SPEC = {
  bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5,
  yieldTarget: 0.99, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, refSourceOhm: 0, powerBudgetW: 1e-3
}
const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 5 }

let db: Knex
let architect: string
let manager: string
const tag = `pf-${Date.now()}`

beforeAll(async () => {
  db = testDb()
  architect = await signIn(DEMO.architect)
  manager = await signIn(DEMO.manager)
  // A second team's study must never show up.
  const [teamId] = await db('teams').insert({ name: 'Portfolio Other', slug: `pf-other-${Date.now()}` })
  const [userId] = await db('users').insert({ team_id: teamId, email: `${tag}@other.example`, display_name: 'O', password_hash: await bcrypt.hash('x-other-pass-123', 4), role: 'architect' })
  await db('studies').insert({ team_id: teamId, owner_id: userId, title: `${tag} other team`, spec: JSON.stringify(SPEC) })
})
afterAll(async () => {
  await db.destroy()
})

async function createStudy(title: string): Promise<number> {
  const res = await api<{ id: number }>('/api/studies', { method: 'POST', cookie: architect, body: { title, blockName: `${tag} block`, spec: SPEC } })
  expect(res.status).toBe(201)
  return res.body.id
}

describe('portfolio', () => {
  it('shows a saved evaluation\'s recommended option, area against budget and failing findings', async () => {
    const id = await createStudy(`${tag} evaluated`)
    const job = await api<{ id: number }>('/api/evaluations', { method: 'POST', cookie: architect, body: { spec: SPEC, process: PROCESS, options: { trials: 100, seed: 3 } } })
    let done: { status: string, result: { recommendedId: string | null, candidates: { id: string, metrics: { totalAreaMm2: number } }[] } } | undefined
    for (let i = 0; i < 300 && done?.status !== 'done'; i++) {
      done = (await api<typeof done>(`/api/evaluations/${job.body.id}`, { cookie: architect })).body
      if (done?.status !== 'done') await new Promise(r => setTimeout(r, 100))
    }
    const job2 = await db('evaluations').where({ id: job.body.id }).first('input')
    const input = typeof job2.input === 'string' ? JSON.parse(job2.input) : job2.input
    const saved = await api(`/api/studies/${id}/revisions`, { method: 'POST', cookie: architect, body: { baseVersion: 0, ...input, evaluationId: job.body.id } })
    expect(saved.status).toBe(201)
    const page = await api<PortfolioPage>(`/api/portfolio?q=${encodeURIComponent(`${tag} evaluated`)}`, { cookie: manager })
    const row = page.body.items[0]!
    const rec = done!.result.recommendedId
    expect(row).toMatchObject({ id, evaluated: true, recommendedId: rec, areaBudgetMm2: 0.05 })
    expect(row.areaMm2).toBe(rec ? done!.result.candidates.find(c => c.id === rec)!.metrics.totalAreaMm2 : null)
    expect(row.failCount).toBeGreaterThanOrEqual(0)
  })

  it('filters by text and status, sorts on the server, pages, and never shows another team', async () => {
    for (const n of ['b', 'a', 'c']) await createStudy(`${tag} sort ${n}`)
    const asc = await api<PortfolioPage>(`/api/portfolio?q=${tag}%20sort&sort=title&dir=asc`, { cookie: manager })
    expect(asc.body.items.map(r => r.title)).toEqual([`${tag} sort a`, `${tag} sort b`, `${tag} sort c`])
    const paged = await api<PortfolioPage>(`/api/portfolio?q=${tag}%20sort&sort=title&dir=desc&pageSize=2&page=2`, { cookie: manager })
    expect(paged.body.total).toBe(3)
    expect(paged.body.items.map(r => r.title)).toEqual([`${tag} sort a`])
    const decided = await api<PortfolioPage>(`/api/portfolio?q=${tag}&status=decided`, { cookie: manager })
    expect(decided.body.total).toBe(0)
    const all = await api<PortfolioPage>(`/api/portfolio?q=${tag}&pageSize=100`, { cookie: manager })
    expect(all.body.items.map(r => r.title)).not.toContain(`${tag} other team`)
    // LIKE wildcards in the search are matched literally.
    expect((await api<PortfolioPage>('/api/portfolio?q=%25%25%25', { cookie: manager })).body.total).toBe(0)
  })

  it('exports the same rows as CSV with a download name, formulas neutralised', async () => {
    await createStudy(`=HYPERLINK("x") ${tag}`)
    const res = await api<string>(`/api/portfolio/export?q=${tag}&sort=title&dir=asc`, { cookie: manager })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/)
    expect(res.headers.get('content-disposition')).toMatch(/attachment; filename="rungwise-portfolio-\d{4}-\d{2}-\d{2}\.csv"/)
    const lines = String(res.body).trim().split('\n')
    expect(lines[0]).toBe('id,title,block,status,bits,owner,revision,recommended,area_mm2,area_budget_mm2,failing_findings,candidates_meeting_spec,candidates,open_notes,last_activity_utc,chosen,option,waivers')
    expect(lines.length).toBe(1 + (await api<PortfolioPage>(`/api/portfolio?q=${tag}&pageSize=100`, { cookie: manager })).body.total)
    expect(String(res.body)).toContain('"\'=HYPERLINK(""x"")')
  })

  it('answers bad filters with 400 naming the field', async () => {
    const res = await api<{ message: string }>('/api/portfolio?sort=owner&dir=up', { cookie: manager })
    expect(res.status).toBe(400)
    expect(res.body.message).toContain('sort')
    expect(res.body.message).toContain('dir')
  })
})
