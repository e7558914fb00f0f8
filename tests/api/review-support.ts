import type { Knex } from 'knex'
import { expect } from 'vitest'
import { api } from '../support/http'
import { caughtMail } from '../support/mail-catcher'

export const SPEC = {
  bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5,
  yieldTarget: 0.99, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, refSourceOhm: 0, powerBudgetW: 1e-3
}
export const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 5 }

export interface Evaluated { evaluationId: number, input: { spec: object, process: object, options: object }, candidateIds: string[], recommendedId: string | null }

/** A finished Monte Carlo evaluation (run by the app's own pool) whose inputs a revision can be saved with. */
export async function evaluate(db: Knex, cookie: string): Promise<Evaluated> {
  const job = await api<{ id: number }>('/api/evaluations', { method: 'POST', cookie, body: { spec: SPEC, process: PROCESS, options: { trials: 100, seed: 3 } } })
  expect(job.status).toBe(202)
  let done: { status: string, result: { recommendedId: string | null, candidates: { id: string }[] } } | undefined
  for (let i = 0; i < 600 && done?.status !== 'done'; i++) {
    done = (await api<typeof done>(`/api/evaluations/${job.body.id}`, { cookie })).body
    if (done?.status !== 'done') await new Promise(r => setTimeout(r, 100))
  }
  expect(done?.status).toBe('done')
  const row = await db('evaluations').where({ id: job.body.id }).first('input')
  const input = typeof row.input === 'string' ? JSON.parse(row.input) : row.input
  return { evaluationId: job.body.id, input, candidateIds: done!.result.candidates.map(c => c.id), recommendedId: done!.result.recommendedId }
}

/** A new study of `cookie`'s user with revision 1 saved with the evaluation's results. */
export async function studyWithResults(cookie: string, ev: Evaluated, title: string): Promise<number> {
  const created = await api<{ id: number }>('/api/studies', { method: 'POST', cookie, body: { title, spec: SPEC } })
  expect(created.status).toBe(201)
  const saved = await api(`/api/studies/${created.body.id}/revisions`, { method: 'POST', cookie, body: { baseVersion: 0, ...ev.input, evaluationId: ev.evaluationId } })
  expect(saved.status, JSON.stringify(saved.body)).toBe(201)
  return created.body.id
}

export interface ReviewState { status: string, statusVersion: number, version: number, entries: { id: number, kind: string, revision: number, comment: string | null }[], decisions: { id: number, candidateId: string, supersededAt: string | null }[] }

export async function reviewOf(id: number, cookie: string): Promise<ReviewState> {
  const res = await api<ReviewState>(`/api/studies/${id}/review`, { cookie })
  expect(res.status).toBe(200)
  return res.body
}

export function post<T = ReviewState>(id: number, step: string, cookie: string, body: Record<string, unknown>) {
  return api<T & { message?: string, data?: { currentStatusVersion?: number } }>(`/api/studies/${id}/${step}`, { method: 'POST', cookie, body })
}

/** Waits until `n` caught messages match, then a little longer, and returns the matches (so "exactly n" can be checked). */
export async function mailsMatching(dir: string, match: (m: { to: string[], subject: string }) => boolean, n: number): Promise<ReturnType<typeof caughtMail>> {
  const until = Date.now() + 20_000
  while (caughtMail(dir).filter(match).length < n && Date.now() < until) await new Promise(r => setTimeout(r, 100))
  // The sender polls every 200 ms in the tests: a duplicate would arrive within this wait.
  await new Promise(r => setTimeout(r, 1500))
  return caughtMail(dir).filter(match)
}
