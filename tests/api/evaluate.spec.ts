import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'

interface Candidate { id: string, topology: string, unaryBits: number | null, metrics: Record<string, number | null> }
interface Output { engineVersion: string, candidates: Candidate[] }
interface Job { id: number, status: string, progress: { done: number, total: number }, result: Output | null, userId: number }

const input = (bits: number, trials: number) => ({
  spec: {
    bits, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, loadResistanceOhm: null, inlTargetLsb: 0.5,
    dnlTargetLsb: 0.5, yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10,
    refSourceOhm: 0, powerBudgetW: 1e-3
  },
  process: {
    sheetOhmPerSq: 1000, matchingPctUm: 1.0, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 50,
    switchSkewS: 1e-10, switchChargeC: 1e-15, switchAreaUm2: 4, gateAreaUm2: 2, layoutOverhead: 2, minWidthUm: 0.4, minLengthUm: 1
  },
  options: { topologies: ['string', 'r2r-voltage', 'r2r-current', 'segmented', 'two-stage-string'], trials, seed: 7, inlDefinition: 'endpoint' }
})

// The metric names the issue fixes as contract (scripts of users depend on them).
const CONTRACT_METRICS = ['resistorCount', 'unitResistorCount', 'switchCount', 'decoderGateCount', 'unitAreaUm2', 'resistorAreaMm2',
  'switchAreaMm2', 'totalAreaMm2', 'inlSigmaLsb', 'dnlSigmaLsb', 'inlYield', 'dnlYield', 'monotonicYield', 'glitchWorstVs',
  'glitchWorstFromCode', 'glitchWorstToCode', 'rinMinOhm', 'rinMaxOhm', 'irefMaxA', 'refSourceMaxOhm', 'routMaxOhm', 'tauS',
  'settlingS', 'maxUpdateRateHz', 'noiseVrms', 'refPowerMaxW']

let db: Knex
let engineer: string
let architect: string
beforeAll(async () => {
  db = testDb()
  engineer = await signIn(DEMO.engineer)
  architect = await signIn(DEMO.architect)
})
afterAll(async () => {
  await db.destroy()
})

async function waitForJob(id: number, cookie: string, until: (job: Job) => boolean): Promise<Job> {
  const deadline = Date.now() + 60_000
  for (;;) {
    const res = await api<Job>(`/api/evaluations/${id}`, { cookie })
    if (until(res.body) || Date.now() > deadline) return res.body
    await new Promise(r => setTimeout(r, 100))
  }
}

describe('POST /api/evaluate', () => {
  it('evaluates every candidate and the whole segmentation sweep with the contract metric names', async () => {
    const res = await api<Output>('/api/evaluate', { method: 'POST', cookie: engineer, body: input(8, 200) })
    expect(res.status).toBe(200)
    expect(res.body.engineVersion).toMatch(/^\d+\.\d+\.\d+/)
    const segmented = res.body.candidates.filter(c => c.topology === 'segmented').map(c => c.unaryBits)
    expect(segmented).toEqual([1, 2, 3, 4, 5, 6, 7])
    for (const c of res.body.candidates) {
      for (const m of CONTRACT_METRICS) expect(c.metrics, `${c.id}.${m}`).toHaveProperty(m)
    }
  })

  it('gives the same numbers for the same seed (reproducible Monte Carlo)', async () => {
    const a = await api<Output>('/api/evaluate', { method: 'POST', cookie: engineer, body: input(6, 300) })
    const b = await api<Output>('/api/evaluate', { method: 'POST', cookie: engineer, body: input(6, 300) })
    expect(a.body.candidates.map(c => c.metrics.inlYield)).toEqual(b.body.candidates.map(c => c.metrics.inlYield))
  })

  it.each([
    ['bits out of range', (b: ReturnType<typeof input>) => ({ ...b, spec: { ...b.spec, bits: 40 } }), 'spec.bits'],
    ['too many trials', (b: ReturnType<typeof input>) => ({ ...b, options: { ...b.options, trials: 10_000_000 } }), 'options.trials'],
    ['an unknown topology', (b: ReturnType<typeof input>) => ({ ...b, options: { ...b.options, topologies: ['flash'] } }), 'options.topologies[0]'],
    ['a negative sheet resistance', (b: ReturnType<typeof input>) => ({ ...b, process: { ...b.process, sheetOhmPerSq: -1 } }), 'process.sheetOhmPerSq']
  ])('answers %s with 400 naming the field', async (_label, change, field) => {
    const res = await api<{ message: string }>('/api/evaluate', { method: 'POST', cookie: engineer, body: change(input(8, 100)) })
    expect(res.status).toBe(400)
    expect(res.body.message).toContain(field)
  })
})

describe('evaluation jobs', () => {
  it('runs a job off the request thread, reports progress, and ends with the same result as the direct call', async () => {
    const started = await api<Job>('/api/evaluations', { method: 'POST', cookie: engineer, body: input(8, 200) })
    expect(started.status).toBe(202)
    expect(started.body.progress.total).toBeGreaterThan(0)
    // The server keeps answering other requests while the job runs.
    expect((await api('/api/health')).status).toBe(200)
    const job = await waitForJob(started.body.id, engineer, j => j.status === 'done' || j.status === 'failed')
    expect(job.status).toBe('done')
    expect(job.progress.done).toBe(job.progress.total)
    const direct = await api<Output>('/api/evaluate', { method: 'POST', cookie: engineer, body: input(8, 200) })
    expect(job.result!.candidates.map(c => c.metrics.totalAreaMm2)).toEqual(direct.body.candidates.map(c => c.metrics.totalAreaMm2))
    expect(job.result!.candidates.map(c => c.metrics.dnlYield)).toEqual(direct.body.candidates.map(c => c.metrics.dnlYield))
    // stored gzip-compressed (a worker compresses it), a fraction of the JSON text the API returns
    const row = await db('evaluations').where({ id: started.body.id }).first('result', 'result_gz')
    expect(row.result).toBeNull()
    expect(row.result_gz.length).toBeLessThan(JSON.stringify(job.result).length / 3)
  })

  it('cancels a running job for its owner; another member gets 403 and another team 404', async () => {
    const started = await api<Job>('/api/evaluations', { method: 'POST', cookie: engineer, body: input(16, 2000) })
    expect(started.status).toBe(202)
    expect((await api(`/api/evaluations/${started.body.id}`, { method: 'DELETE', cookie: architect })).status).toBe(403)
    const cancelled = await api<Job>(`/api/evaluations/${started.body.id}`, { method: 'DELETE', cookie: engineer })
    expect(cancelled.status).toBe(200)
    expect(cancelled.body.status).toBe('cancelled')
    const [otherTeam] = await db('teams').insert({ name: 'Elsewhere', slug: `elsewhere-${Date.now()}` })
    await db('evaluations').where({ id: started.body.id }).update({ team_id: otherTeam })
    expect((await api(`/api/evaluations/${started.body.id}`, { cookie: engineer })).status).toBe(404)
  })

  it('limits how many evaluations one user runs at once (429), without touching other users', async () => {
    await db('evaluations').where({ status: 'running' }).orWhere({ status: 'queued' }).update({ status: 'cancelled' })
    const a = await api<Job>('/api/evaluations', { method: 'POST', cookie: engineer, body: input(16, 2000) })
    const b = await api<Job>('/api/evaluations', { method: 'POST', cookie: engineer, body: input(16, 2000) })
    const c = await api('/api/evaluations', { method: 'POST', cookie: engineer, body: input(8, 100) })
    expect([a.status, b.status, c.status]).toEqual([202, 202, 429])
    const other = await api<Job>('/api/evaluations', { method: 'POST', cookie: architect, body: input(6, 100) })
    expect(other.status).toBe(202)
    for (const job of [a.body, b.body, other.body]) await api(`/api/evaluations/${job.id}`, { method: 'DELETE', cookie: job === other.body ? architect : engineer })
  })
})
