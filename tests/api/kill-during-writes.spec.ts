import { execFileSync } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import knex from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { knexConfig } from '../../server/db/knexfile'
import { startAppServer, stopAppServer, type AppServer } from '../support/app-server'
import { DEMO, DEMO_PASSWORD } from '../support/http'
import { destroyTestDatabase, startInstance, startTestDatabase, type TestDatabase } from '../support/mariadb'

/**
 * A write burst (study creates, each followed by its first and second revision) while mariadbd is
 * killed with SIGKILL and restarted on the same datadir. With innodb-flush-log-at-trx-commit=1 (the
 * MariaDB default; the other tests turn it off for speed) every acknowledged commit is durable,
 * so every 2xx must be there afterwards; transactions mean no study without its revisions' head,
 * and the app must recover by itself, without a restart.
 */
const root = fileURLToPath(new URL('../..', import.meta.url))
const SPEC = { bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }
const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }
const WORKERS = 12

let database: TestDatabase
let server: AppServer

beforeAll(async () => {
  database = await startTestDatabase(['innodb-flush-log-at-trx-commit=1'])
  for (const command of ['latest', 'seed']) {
    execFileSync(process.execPath, ['--import', 'tsx', 'scripts/migrate.ts', command], { cwd: root, env: { ...process.env, NUXT_DATABASE_URL: database.url }, stdio: 'pipe' })
  }
  server = await startAppServer(database.url)
}, 180_000)
afterAll(async () => {
  await stopAppServer(server)
  await destroyTestDatabase(database)
})

async function post(path: string, body: unknown, cookie: string): Promise<{ status: number, body: { id?: number, number?: number } }> {
  try {
    const res = await fetch(`${server.url}${path}`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body: JSON.stringify(body), signal: AbortSignal.timeout(15_000) })
    const text = await res.text()
    return { status: res.status, body: text.startsWith('{') ? JSON.parse(text) : {} }
  } catch {
    return { status: 0, body: {} }
  }
}

const pause = (ms: number) => new Promise(r => setTimeout(r, ms))

describe('killing MariaDB in the middle of a write burst', () => {
  it('keeps every acknowledged write, leaves no half-written study, and recovers without an app restart', async () => {
    const login = await fetch(`${server.url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: DEMO.engineer, password: DEMO_PASSWORD }) })
    const cookie = login.headers.getSetCookie().find(c => c.startsWith('rw_session='))!.split(';')[0]!
    const ackStudies = new Map<number, string>()
    const ackRevisions: { studyId: number, number: number }[] = []
    const statuses: number[] = []
    let stop = false
    let serial = 0

    const worker = async () => {
      while (!stop) {
        const title = `Crash burst ${++serial}`
        const created = await post('/api/studies', { title, spec: SPEC }, cookie)
        statuses.push(created.status)
        if (created.status !== 201) {
          await pause(50)
          continue
        }
        ackStudies.set(created.body.id!, title)
        for (const baseVersion of [0, 1]) {
          const rev = await post(`/api/studies/${created.body.id}/revisions`, { baseVersion, spec: SPEC, process: PROCESS, options: { topologies: ['string'], trials: 0, seed: 1 } }, cookie)
          statuses.push(rev.status)
          if (rev.status !== 201) break
          ackRevisions.push({ studyId: created.body.id!, number: rev.body.number! })
        }
      }
    }
    const burst = Promise.all(Array.from({ length: WORKERS }, worker))
    // Kill once the burst is in full swing.
    while (ackStudies.size < 20) await pause(20)
    const pid = Number(readFileSync(join(database.dir, 'db.pid'), 'utf8').trim())
    process.kill(pid, 'SIGKILL')
    const killedAt = ackStudies.size
    await pause(1500)
    const during = await fetch(`${server.url}/api/health`)
    expect(during.status).toBe(503)
    await startInstance(database.cnf)
    // The app reconnects on its own: wait for health, then let the burst write a little more.
    const until = Date.now() + 60_000
    while ((await fetch(`${server.url}/api/health`).then(r => r.status, () => 0)) !== 200) {
      if (Date.now() > until) throw new Error('the app did not recover within 60 s')
      await pause(200)
    }
    const recoveredAt = ackStudies.size
    while (ackStudies.size < recoveredAt + 10) await pause(20)
    stop = true
    await burst
    expect(server.process.exitCode, 'the app server kept running').toBeNull()

    const db = knex(knexConfig(database.url))
    try {
      const studies = await db('studies').whereIn('id', [...ackStudies.keys()]).select('id', 'title')
      expect(new Map(studies.map(s => [s.id, s.title]))).toEqual(ackStudies)
      const revisions = await db('study_revisions').whereIn('study_id', [...ackStudies.keys()]).select('study_id', 'number')
      const have = new Set(revisions.map(r => `${r.study_id}:${r.number}`))
      expect(ackRevisions.filter(r => !have.has(`${r.studyId}:${r.number}`)), 'acknowledged revisions missing').toEqual([])
      // No half-written study: its version is exactly its number of revisions, numbered 1…version.
      const [torn] = await db.raw(`SELECT s.id, s.version, COUNT(r.id) AS n, COALESCE(MAX(r.number), 0) AS top FROM studies s
        LEFT JOIN study_revisions r ON r.study_id = s.id GROUP BY s.id, s.version HAVING n <> s.version OR top <> s.version`)
      expect(torn).toEqual([])
      const [orphans] = await db.raw('SELECT r.id FROM study_revisions r LEFT JOIN studies s ON s.id = r.study_id WHERE s.id IS NULL')
      expect(orphans).toEqual([])
      // Each study's creation is audited in its own transaction: a study row implies its audit row.
      const [unaudited] = await db.raw('SELECT s.id FROM studies s LEFT JOIN audit_log a ON a.target_type = \'study\' AND a.target_id = CAST(s.id AS CHAR) AND a.action = \'study_created\' WHERE a.id IS NULL AND s.title LIKE \'Crash burst %\'')
      expect(unaudited).toEqual([])
    } finally {
      await db.destroy()
    }
    // Refusals during the outage were 503 (or the connection dropped as the server went away), never 500.
    expect(statuses.filter(s => s !== 201 && s !== 503 && s !== 0), `statuses other than 201/503: ${[...new Set(statuses)].join(', ')}\n${server.log().split('\n').filter(l => !/Acquire connection error|afterConnect/.test(l)).join('\n').slice(-6000)}`).toEqual([])
    expect(killedAt).toBeGreaterThanOrEqual(20)
    const list = await fetch(`${server.url}/api/studies`, { headers: { cookie } })
    expect(list.status).toBe(200)
  }, 240_000)
})
