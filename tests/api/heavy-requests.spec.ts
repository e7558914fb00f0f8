import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'
import { SPEC as SPEC8 } from './fuzz-table'

/**
 * Heavy requests (evaluate, netlists, solves, bench comparisons, dry runs, evaluation jobs) hold a per-user slot in MariaDB while
 * they run; with every slot taken, the next one is 429. Slots held by "other instances" are rows
 * inserted here, which is exactly how a second app instance's requests would show up.
 */
const SPEC = { ...SPEC8, bits: 16 }
const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }
const EVALUATE = { spec: SPEC8, process: PROCESS, options: { topologies: ['r2r-voltage'], trials: 0, seed: 1 } }

let db: Knex
let cookie = ''
let userId = 0

beforeAll(async () => {
  db = testDb()
  cookie = await signIn(DEMO.architect)
  userId = (await db('users').where({ email: DEMO.architect }).first('id')).id
})
afterAll(async () => {
  await db('heavy_requests').where({ user_id: userId }).delete()
  await db.destroy()
})

describe('heavy requests per user', () => {
  it('answers 429 naming the limit while the user holds every slot, and runs again once one is free', async () => {
    const [a] = await db('heavy_requests').insert({ user_id: userId, kind: 'evaluate' })
    await db('heavy_requests').insert({ user_id: userId, kind: 'netlist' })
    for (const [path, body] of [['/api/evaluate', EVALUATE], ['/api/netlist', { spec: SPEC, process: PROCESS, candidate: { topology: 'string' } }]] as const) {
      const refused = await api<{ message: string }>(path, { method: 'POST', cookie, body })
      expect(refused.status, JSON.stringify(refused.body)).toBe(429)
      expect(refused.body.message).toContain('At most 2 heavy requests (evaluations and evaluation jobs, netlists, solves, bench comparisons, dry runs) may run at once per user')
    }
    // Another user is not affected.
    expect((await api('/api/evaluate', { method: 'POST', cookie: await signIn(DEMO.engineer), body: EVALUATE })).status).toBe(200)
    await db('heavy_requests').where({ id: a }).delete()
    expect((await api('/api/evaluate', { method: 'POST', cookie, body: EVALUATE })).status).toBe(200)
    // The request gave its slot back: one row (the one left from above) remains.
    expect(Number((await db('heavy_requests').where({ user_id: userId }).count({ n: '*' }))[0]!.n)).toBe(1)
  })

  it('does not count a slot left behind by an instance that died (no heartbeat for over 60 s)', async () => {
    await db('heavy_requests').where({ user_id: userId }).delete()
    const old = new Date(Date.now() - 61_000)
    await db('heavy_requests').insert([{ user_id: userId, kind: 'evaluate', started_at: old, heartbeat_at: old }, { user_id: userId, kind: 'job', started_at: old, heartbeat_at: old }])
    const res = await api('/api/evaluate', { method: 'POST', cookie, body: EVALUATE })
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200)
  })

  // Issue 13, finding 5: a job left "running" by an instance that died kept its owner at the cap.
  it('fails a job whose instance died (no heartbeat for over 60 s) with a reason, and its slot no longer counts', async () => {
    await db('heavy_requests').where({ user_id: userId }).delete()
    const user = await db('users').where({ id: userId }).first('team_id')
    const old = new Date(Date.now() - 61_000)
    const ids: number[] = []
    for (let i = 0; i < 2; i++) {
      const [id] = await db('evaluations').insert({ team_id: user.team_id, user_id: userId, status: 'running', tasks_total: 4, tasks_done: 1, input: JSON.stringify(EVALUATE), engine_version: 'dead-instance', created_at: old, heartbeat_at: old })
      await db('heavy_requests').insert({ user_id: userId, kind: 'job', evaluation_id: id, started_at: old, heartbeat_at: new Date() })
      ids.push(id!)
    }
    // the slots' heartbeats look fresh (as if the rows were just refreshed), but their jobs were abandoned
    const job = await api<{ status: string, error: string }>(`/api/evaluations/${ids[0]}`, { cookie })
    expect(job.body.status).toBe('failed')
    expect(job.body.error).toMatch(/interrupted/)
    const started = await api<{ id: number }>('/api/evaluations', { method: 'POST', cookie, body: EVALUATE })
    expect(started.status, JSON.stringify(started.body)).toBe(202)
    expect((await db('evaluations').where({ id: ids[1] }).first('status')).status).toBe('failed')
    await api(`/api/evaluations/${started.body.id}`, { method: 'DELETE', cookie })
    await db('heavy_requests').where({ user_id: userId }).delete()
  })

  it('builds the 16-bit string netlist (65,536 resistors) on the worker pool and answers JSON', async () => {
    await db('heavy_requests').where({ user_id: userId }).delete()
    const res = await api<{ netlist: string, format: string }>('/api/netlist', { method: 'POST', cookie, body: { spec: SPEC, process: PROCESS, candidate: { topology: 'string' } } })
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200)
    expect(res.headers.get('content-type')).toContain('application/json')
    expect(res.body.format).toBe('spice')
    // A 2^16-tap string: 2^16 resistors (derived: one resistor per LSB step of a resistor string).
    expect(res.body.netlist.match(/^R\S*\s/gim)?.length).toBe(65_536)
  })
})
