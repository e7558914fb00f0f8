import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import { expect } from 'vitest'
import { REQUIRED_METRICS } from '../../shared/core/contract/evaluate-output'
import type { NoteDto, NoteThreadDto } from '../../shared/types/notes'
import { api, DEMO, signIn } from '../support/http'

export const SPEC = { bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }

export type Cookies = Record<'admin' | 'architect' | 'engineer' | 'manager' | 'otherTeam', string>

/** Signed-in demo members and an engineer of a second team. */
export async function cookies(db: Knex, tag: string): Promise<Cookies> {
  const [admin, architect, engineer, manager] = await Promise.all([signIn(DEMO.admin), signIn(DEMO.architect), signIn(DEMO.engineer), signIn(DEMO.manager)])
  const [teamId] = await db('teams').insert({ name: `Notes Other ${tag}`, slug: `notes-other-${tag}-${Date.now()}` })
  const email = `notes-${tag}-${Date.now()}@other.example`
  await db('users').insert({ team_id: teamId, email, display_name: 'Other Annotator', password_hash: await bcrypt.hash('other-team-pass', 4), role: 'engineer' })
  return { admin: admin!, architect: architect!, engineer: engineer!, manager: manager!, otherTeam: await signIn(email, 'other-team-pass') }
}

export async function newStudy(cookie: string, title: string): Promise<number> {
  const res = await api<{ id: number }>('/api/studies', { method: 'POST', cookie, body: { title, spec: SPEC } })
  expect(res.status).toBe(201)
  return res.body.id
}

/**
 * Saves the next revision straight into the table with results in the output contract's shape
 * (arbitrary metric values: these tests check how notes follow a number, not physics).
 */
export async function saveResults(db: Knex, studyId: number, inlSigmaLsb: number): Promise<number> {
  const study = await db('studies').where({ id: studyId }).first('version', 'owner_id')
  const series = { codes: [0], min: [0], max: [0] }
  const metrics = { ...Object.fromEntries(REQUIRED_METRICS.map(m => [m, 1])), inlSigmaLsb }
  const candidate = { id: 'string', topology: 'string', unaryBits: null, metrics, meetsSpec: true, failing: [], linearity: { definition: 'endpoint', monteCarlo: null }, glitch: { perTransition: series }, reference: { irefA: series, rinOhm: series }, output: { routOhm: series } }
  const number = study.version + 1
  await db('study_revisions').insert({ study_id: studyId, number, spec: JSON.stringify(SPEC), process: '{}', options: '{}', engine_version: 'fixture', results: JSON.stringify({ engineVersion: 'fixture', candidates: [candidate], cautions: [] }), author_id: study.owner_id })
  await db('studies').where({ id: studyId }).update({ version: number })
  return number
}

export type NoteResponse = NoteDto & { message: string, data: { currentVersion?: number, issues?: { path: string }[] } }

export const writeNote = (cookie: string, studyId: number, body: Record<string, unknown>) =>
  api<NoteResponse>(`/api/studies/${studyId}/notes`, { method: 'POST', cookie, body })

export const threads = async (cookie: string, studyId: number) => (await api<NoteThreadDto[]>(`/api/studies/${studyId}/notes`, { cookie })).body
