import { execFileSync } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startAppServer, stopAppServer, type AppServer } from '../support/app-server'
import { DEMO, DEMO_PASSWORD } from '../support/http'
import { destroyTestDatabase, startInstance, startTestDatabase, type TestDatabase } from '../support/mariadb'

/**
 * Issue 13, finding 5: evaluation jobs caught by a database outage stayed "running" forever and
 * the per-user cap kept answering 429. Here the test's own MariaDB is SIGKILLed while two jobs of
 * one user run; after it is back both jobs must be failed with a reason within the slot stale
 * period (60 s, server/utils/heavyRequests.ts), and the user must be able to start a job at once.
 */
const root = fileURLToPath(new URL('../..', import.meta.url))
const STALE_PERIOD_MS = 60_000
// 12 bits at the largest trial count: many Monte Carlo chunks, seconds of work per job
const JOB = {
  spec: { bits: 12, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 },
  process: { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' },
  options: { trials: 100_000, seed: 7 }
}

let database: TestDatabase
let server: AppServer

beforeAll(async () => {
  database = await startTestDatabase()
  for (const command of ['latest', 'seed']) {
    execFileSync(process.execPath, ['--import', 'tsx', 'scripts/migrate.ts', command], { cwd: root, env: { ...process.env, NUXT_DATABASE_URL: database.url }, stdio: 'pipe' })
  }
  server = await startAppServer(database.url)
}, 180_000)
afterAll(async () => {
  await stopAppServer(server)
  await destroyTestDatabase(database)
})

const pause = (ms: number) => new Promise(r => setTimeout(r, ms))

async function call<T>(path: string, cookie: string, method = 'GET', body?: unknown): Promise<{ status: number, body: T }> {
  const res = await fetch(`${server.url}${path}`, { method, headers: { 'content-type': 'application/json', cookie }, body: body === undefined ? undefined : JSON.stringify(body) })
  const text = await res.text()
  return { status: res.status, body: (text.startsWith('{') ? JSON.parse(text) : {}) as T }
}

interface Job { id: number, status: string, error: string | null, progress: { done: number, total: number } }

describe('evaluation jobs during a database outage', () => {
  it('ends both jobs as failed with a reason once the database is back, and frees the cap at once', async () => {
    const login = await fetch(`${server.url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: DEMO.engineer, password: DEMO_PASSWORD }) })
    const cookie = login.headers.getSetCookie().find(c => c.startsWith('rw_session='))!.split(';')[0]!
    const jobs = await Promise.all([call<Job>('/api/evaluations', cookie, 'POST', JOB), call<Job>('/api/evaluations', cookie, 'POST', JOB)])
    expect(jobs.map(j => j.status)).toEqual([202, 202])
    expect((await call('/api/evaluations', cookie, 'POST', JOB)).status).toBe(429)
    // both running and under way
    const until = Date.now() + 30_000
    for (;;) {
      const seen = await Promise.all(jobs.map(j => call<Job>(`/api/evaluations/${j.body.id}?result=0`, cookie)))
      if (seen.every(s => s.body.status === 'running' && s.body.progress.done >= 1)) break
      expect(seen.every(s => s.body.status === 'queued' || s.body.status === 'running'), JSON.stringify(seen.map(s => s.body))).toBe(true)
      if (Date.now() > until) throw new Error('the jobs did not start within 30 s')
      await pause(100)
    }
    process.kill(Number(readFileSync(join(database.dir, 'db.pid'), 'utf8').trim()), 'SIGKILL')
    await pause(3000)
    expect((await fetch(`${server.url}/api/health`)).status).toBe(503)
    await startInstance(database.cnf)
    const back = Date.now()
    while ((await fetch(`${server.url}/api/health`).then(r => r.status, () => 0)) !== 200) {
      if (Date.now() - back > 60_000) throw new Error('the app did not recover within 60 s')
      await pause(200)
    }
    let ended: Job[] = []
    for (;;) {
      ended = (await Promise.all(jobs.map(j => call<Job>(`/api/evaluations/${j.body.id}?result=0`, cookie)))).map(r => r.body)
      if (ended.every(j => j.status === 'failed')) break
      if (Date.now() - back > STALE_PERIOD_MS) throw new Error(`jobs not failed within the stale period: ${JSON.stringify(ended)}`)
      await pause(250)
    }
    for (const job of ended) expect(job.error).toMatch(/interrupted|database/i)
    // the cap is free at once: a new job starts, and runs
    const again = await call<Job>('/api/evaluations', cookie, 'POST', { ...JOB, options: { trials: 0, seed: 1 } })
    expect(again.status, JSON.stringify(again.body)).toBe(202)
    expect(server.process.exitCode, 'the app server kept running').toBeNull()
  }, 240_000)
})
