/**
 * One truth (issue 12): the recommendation a revision stores is the one every view shows; a
 * decision on a failing candidate needs a waiver per failing line; an imported document's results
 * are computed again by this engine. The expectations are consistency between views and the
 * product's rules ("one number everywhere": common practice, no source); no engine number is
 * pinned here, since the engine's sizing changes under its own tests.
 */
import type { Knex } from 'knex'
import { parse } from 'csv-parse/sync'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { StudyDocument } from '../../shared/io/studyDocument'
import type { BriefDto } from '../../shared/types/brief'
import type { PortfolioPage } from '../../shared/types/portfolio'
import type { ReviewStateDto } from '../../shared/types/review'
import type { RevisionDto } from '../../shared/types/revisions'
import type { StudyDto } from '../../shared/types/studies'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'
import { mailsMatching, PROCESS, SPEC } from './review-support'

let db: Knex
let engineer: string
let architect: string
let manager: string
let architectId: number
const tag = `truth-${Date.now()}`
// Weights far from the defaults (area 3, yield margin 2, …): a default-weights pick anywhere would disagree.
const WEIGHTS = { area: 0, yieldMargin: 0, glitch: 10, referenceLoad: 0, settlingMargin: 10, power: 0, complexity: 10 }

beforeAll(async () => {
  db = testDb()
  ;[engineer, architect, manager] = await Promise.all([signIn(DEMO.engineer), signIn(DEMO.architect), signIn(DEMO.manager)])
  architectId = (await db('users').where({ email: DEMO.architect }).first('id')).id
}, 60_000)
afterAll(async () => {
  await db.destroy()
})

/** A finished Monte Carlo job (the app's own pool) for these inputs; its id and stored input. */
async function evaluated(spec: object, trials = 100) {
  const job = await api<{ id: number }>('/api/evaluations', { method: 'POST', cookie: engineer, body: { spec, process: PROCESS, options: { trials, seed: 5 } } })
  expect(job.status).toBe(202)
  let status = ''
  for (let i = 0; i < 600 && status !== 'done'; i++) {
    status = (await api<{ status: string }>(`/api/evaluations/${job.body.id}`, { cookie: engineer })).body.status
    if (status !== 'done') await new Promise(r => setTimeout(r, 100))
  }
  expect(status).toBe('done')
  const row = await db('evaluations').where({ id: job.body.id }).first('input')
  return { evaluationId: job.body.id, input: typeof row.input === 'string' ? JSON.parse(row.input) : row.input }
}

async function studySavedWith(title: string, spec: object, weights?: object): Promise<{ id: number, revision: RevisionDto }> {
  const created = await api<{ id: number }>('/api/studies', { method: 'POST', cookie: engineer, body: { title, blockName: tag, spec } })
  expect(created.status).toBe(201)
  const ev = await evaluated(spec)
  const saved = await api<RevisionDto>(`/api/studies/${created.body.id}/revisions`, { method: 'POST', cookie: engineer, body: { baseVersion: 0, ...ev.input, evaluationId: ev.evaluationId, ...(weights ? { weights } : {}) } })
  expect(saved.status, JSON.stringify(saved.body)).toBe(201)
  return { id: created.body.id, revision: saved.body }
}

const portfolioRow = async (id: number) =>
  (await api<PortfolioPage>(`/api/portfolio?q=${encodeURIComponent(tag)}&pageSize=100`, { cookie: manager })).body.items.find(r => r.id === id)!

/** Every place a study's recommended candidate is shown, read back. */
async function recommendationEverywhere(id: number, number: number) {
  const study = (await api<StudyDto>(`/api/studies/${id}`, { cookie: manager })).body
  const revision = (await api<RevisionDto>(`/api/studies/${id}/revisions/${number}`, { cookie: manager })).body
  const brief = (await api<BriefDto>(`/api/studies/${id}/brief`, { cookie: manager })).body
  const csv = parse((await api<string>(`/api/studies/${id}/comparison`, { cookie: manager })).body) as string[][]
  const col = csv[0]!.indexOf('recommended')
  const csvRecommended = csv.slice(1).filter(r => r[col] === 'yes').map(r => r[0])
  return {
    revision, study: study.recommendedId, stored: revision.recommendation?.candidateId, results: (revision.results as { recommendedId?: string | null }).recommendedId,
    portfolio: (await portfolioRow(id)).recommendedId, brief: brief.recommendation?.candidateId ?? null, csv: csvRecommended[0] ?? null, csvCount: csvRecommended.length
  }
}

describe('one recommendation', () => {
  it('is ranked with the study\'s weights when saved and is the same in the study, revision, portfolio, brief and CSV', async () => {
    const { id, revision } = await studySavedWith(`${tag} weighted`, SPEC, WEIGHTS)
    expect(revision.weights).toEqual(WEIGHTS)
    expect(revision.recommendation?.weights).toEqual(WEIGHTS)
    const seen = await recommendationEverywhere(id, revision.number)
    const rec = seen.stored ?? null
    expect(seen.revision.results).not.toBeNull()
    expect({ study: seen.study, results: seen.results, portfolio: seen.portfolio, brief: seen.brief, csv: seen.csv })
      .toEqual({ study: rec, results: rec, portfolio: rec, brief: rec, csv: rec })
    expect(seen.csvCount).toBe(rec === null ? 0 : 1)
    // the stored ranking is the one the results carry (same weights, same order)
    const ranking = (seen.revision.results as { ranking?: { weights: object } }).ranking
    expect(ranking?.weights).toEqual(WEIGHTS)
    // the portfolio names the candidate in words, as the brief does
    if (rec) expect((await portfolioRow(id)).label).toBe(seen.revision.recommendation?.label)
  }, 120_000)

  it('reopen keeps the decided revision\'s weights and recommendation', async () => {
    const { id, revision } = await studySavedWith(`${tag} reopen`, SPEC, WEIGHTS)
    await decideWithWaivers(id, revision, revision.recommendation?.candidateId ?? revision.results!.candidates[0]!.id)
    const state = (await api<ReviewStateDto>(`/api/studies/${id}/review`, { cookie: architect })).body
    const reopened = await api(`/api/studies/${id}/reopen`, { method: 'POST', cookie: architect, body: { statusVersion: state.statusVersion } })
    expect(reopened.status).toBe(200)
    const copy = (await api<RevisionDto>(`/api/studies/${id}/revisions/${revision.number + 1}`, { cookie: manager })).body
    expect(copy.weights).toEqual(WEIGHTS)
    expect(copy.recommendation?.candidateId).toBe(revision.recommendation?.candidateId)
    expect((await recommendationEverywhere(id, copy.number)).portfolio).toBe(revision.recommendation?.candidateId ?? null)
  }, 120_000)
})

/** Review request, a sign-off, and a decision on `candidateId` with a waiver for each line it fails (read from the revision). */
async function decideWithWaivers(id: number, revision: RevisionDto, candidateId: string) {
  await api(`/api/studies/${id}/review-request`, { method: 'POST', cookie: engineer, body: { statusVersion: 0, reviewerIds: [architectId] } })
  const signed = await api<ReviewStateDto>(`/api/studies/${id}/reviews`, { method: 'POST', cookie: architect, body: { statusVersion: 1, verdict: 'signed_off' } })
  expect(signed.status).toBe(201)
  const failing = revision.results!.candidates.find(c => c.id === candidateId)!.failing
  const waivers = failing.map(line => ({ line, by: 'Programme board', reason: `accepted for the first silicon (${line})` }))
  const signOffIds = signed.body.entries.filter(e => e.kind === 'signed_off').map(e => e.id)
  const res = await api<ReviewStateDto>(`/api/studies/${id}/decision`, { method: 'POST', cookie: architect, body: { statusVersion: 2, candidateId, rationale: 'Chosen for the test.', revision: revision.number, signOffIds, waivers } })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return { waivers, signOffIds }
}

describe('decisions and waivers', () => {
  // An area budget of 1e-4 mm² (100 µm²) no 8-bit resistor DAC fits: every candidate fails at least the area line.
  const TIGHT = { ...SPEC, areaBudgetMm2: 1e-4 }

  it('refuses a decision on a failing candidate without a waiver per failing line (400 naming waivers), and records, shows and mails it with them', async () => {
    const title = `${tag} waivers`
    const { id, revision } = await studySavedWith(title, TIGHT)
    const candidate = revision.results!.candidates[0]!
    expect(candidate.failing).toContain('area')
    await api(`/api/studies/${id}/review-request`, { method: 'POST', cookie: engineer, body: { statusVersion: 0, reviewerIds: [architectId] } })
    const signed = await api<ReviewStateDto>(`/api/studies/${id}/reviews`, { method: 'POST', cookie: architect, body: { statusVersion: 1, verdict: 'signed_off' } })
    const signOffIds = signed.body.entries.filter(e => e.kind === 'signed_off').map(e => e.id)
    const body = { statusVersion: 2, candidateId: candidate.id, rationale: 'Smallest of the failing ones.', revision: revision.number, signOffIds }

    const bare = await api<{ message: string, data: { issues: { path: string }[] } }>(`/api/studies/${id}/decision`, { method: 'POST', cookie: architect, body })
    expect(bare.status).toBe(400)
    expect(bare.body.message).toMatch(/^waivers: /)
    expect(bare.body.message).toContain('(area)')
    expect(bare.body.data.issues[0]!.path).toBe('waivers')
    const stray = await api<{ message: string }>(`/api/studies/${id}/decision`, { method: 'POST', cookie: architect, body: { ...body, waivers: [{ line: 'not-a-line', by: 'x', reason: 'y' }] } })
    expect(stray.status).toBe(400)
    expect(stray.body.message).toMatch(/^waivers\.0\.line: /)
    const partial = candidate.failing.slice(1).map(line => ({ line, by: 'A', reason: 'B' }))
    expect((await api(`/api/studies/${id}/decision`, { method: 'POST', cookie: architect, body: { ...body, waivers: partial } })).status).toBe(400)
    expect((await api<ReviewStateDto>(`/api/studies/${id}/review`, { cookie: architect })).body.status).toBe('in_review')

    const waivers = candidate.failing.map(line => ({ line, by: 'Programme board', reason: `area accepted for the test chip (${line})` }))
    const ok = await api<ReviewStateDto>(`/api/studies/${id}/decision`, { method: 'POST', cookie: architect, body: { ...body, waivers } })
    expect(ok.status, JSON.stringify(ok.body)).toBe(201)
    const recorded = ok.body.decisions.find(d => d.supersededAt === null)!
    expect(recorded.waivers.map(w => [w.line, w.by, w.reason])).toEqual(waivers.map(w => [w.line, w.by, w.reason]))

    const brief = (await api<BriefDto>(`/api/studies/${id}/brief`, { cookie: manager })).body
    expect(brief.decision?.waivers.map(w => w.line)).toEqual(candidate.failing)
    // the portfolio and the brief count failing findings of the same (chosen) candidate, by one definition
    const row = await portfolioRow(id)
    expect(row.chosenId).toBe(candidate.id)
    expect(row.waiverCount).toBe(candidate.failing.length)
    expect(row.failCount).toBe(brief.failCount)
    expect(row.label).toBe(brief.decision?.label)
    expect(row.label).not.toBe(candidate.id)

    const mails = await mailsMatching(inject('mailDir'), m => m.subject === `Decided: ${title}`, 2)
    expect(mails.length).toBeGreaterThan(0)
    for (const m of mails) expect(m.text).toContain('area accepted for the test chip (area)')
  }, 180_000)
})

describe('imports never carry unverified results', () => {
  it('computes a document\'s results again: forged numbers (area 1e-6 mm², yield 1) on changed inputs never show', async () => {
    const { id } = await studySavedWith(`${tag} export`, SPEC)
    const doc = (await api<StudyDocument & { results: { output: { candidates: { metrics: Record<string, number>, meetsSpec: boolean, failing: string[] }[] } } }>(`/api/studies/${id}/export`, { cookie: engineer })).body
    expect(doc.results).not.toBeNull()
    // Forge: every candidate tiny and perfect, and the head's inputs changed under the results.
    for (const c of doc.results.output.candidates) {
      c.metrics.totalAreaMm2 = 1e-6
      c.metrics.yield = 1
      c.meetsSpec = true
      c.failing = []
    }
    const head = doc.revisions.at(-1)! as { inputs: { spec: Record<string, unknown> } }
    head.inputs.spec = { ...head.inputs.spec, areaBudgetMm2: 0.04, vrefV: 1.8 }
    const imported = await api<{ studies: { id: number }[], resultsRecomputed: string | null }>('/api/studies/import', { method: 'POST', cookie: engineer, body: { text: JSON.stringify({ ...doc, study: { ...doc.study, title: `${tag} forged` } }), fileName: 'forged.json' } })
    expect(imported.status, JSON.stringify(imported.body)).toBe(201)
    expect(imported.body.resultsRecomputed).toMatch(/not used/)
    const newId = imported.body.studies[0]!.id
    const rev = (await api<RevisionDto>(`/api/studies/${newId}/revisions/${doc.revisions.length}`, { cookie: engineer })).body
    const candidates = rev.results!.candidates
    expect(candidates.length).toBeGreaterThan(0)
    for (const c of candidates) expect(c.metrics.totalAreaMm2).not.toBe(1e-6) // (a yield of 1 can be honest, 100 of 100 trials)
    // computed for the imported inputs (the engine echoes the spec it evaluated)
    expect((rev.results as { spec?: { areaBudgetMm2: number, vrefV: number } }).spec).toMatchObject({ areaBudgetMm2: 0.04, vrefV: 1.8 })
    const row = await portfolioRow(newId)
    expect(row.areaMm2).not.toBe(1e-6)
    expect(row.recommendedId).toBe(rev.recommendation?.candidateId ?? null)
  }, 180_000)
})
