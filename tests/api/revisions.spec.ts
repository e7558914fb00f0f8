import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { REQUIRED_METRICS } from '../../shared/core/contract/evaluate-output'
import type { StudyDto } from '../../shared/types/studies'
import type { RevisionCompareDto, RevisionDto, RevisionSummaryDto } from '../../shared/types/revisions'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'

const SPEC = { bits: 12, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 10e-12, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.997, areaBudgetMm2: 0.05, glitchLimitVs: 50e-12, powerBudgetW: 1e-3 }
const PROCESS = { sheetOhmPerSq: 300, matchingPctUm: 0.8, matchingConvention: 'pair' }
const OPTIONS = { topologies: ['string', 'segmented'], trials: 500, seed: 7 }

/** Arbitrary metric values in the output contract's shape: these tests check copying and diffing, not physics. */
function fixtureOutput(scale: number) {
  const series = { codes: [0], min: [0], max: [0] }
  const metrics = Object.fromEntries(REQUIRED_METRICS.map((m, i) => [m, i * scale]))
  const candidate = (id: string, topology: string) => ({ id, topology, unaryBits: null, metrics, meetsSpec: true, failing: [], linearity: { definition: 'endpoint', monteCarlo: null }, glitch: { perTransition: series }, reference: { irefA: series, rinOhm: series }, output: { routOhm: series } })
  return { engineVersion: 'fixture', candidates: [candidate('string', 'string'), candidate('segmented-4', 'segmented')], cautions: [] }
}

let db: Knex
let engineer: string
let architect: string
let manager: string
let otherTeam: string
let studyId: number

beforeAll(async () => {
  db = testDb()
  ;[engineer, architect, manager] = await Promise.all([signIn(DEMO.engineer), signIn(DEMO.architect), signIn(DEMO.manager)])
  const [teamId] = await db('teams').insert({ name: 'Revision Other Works', slug: `rev-other-${Date.now()}` })
  const email = `rev-${Date.now()}@other.example`
  await db('users').insert({ team_id: teamId, email, display_name: 'Other Engineer', password_hash: await bcrypt.hash('other-team-pass', 4), role: 'engineer' })
  otherTeam = await signIn(email, 'other-team-pass')
  const study = await api<StudyDto>('/api/studies', { method: 'POST', cookie: engineer, body: { title: 'Revision test study', spec: SPEC } })
  studyId = study.body.id
})
afterAll(async () => {
  await db.destroy()
})

const save = (body: Record<string, unknown>, cookie = engineer) =>
  api<RevisionDto & { message: string, data: { currentVersion: number, issues: { path: string }[] } }>(`/api/studies/${studyId}/revisions`, { method: 'POST', cookie, body })
const revisionCount = async () => Number((await db('study_revisions').where({ study_id: studyId }).count({ n: '*' }))[0]!.n)

describe('study revisions', () => {
  it('starts a new study at version 0 with an empty History', async () => {
    expect((await api<StudyDto>(`/api/studies/${studyId}`, { cookie: engineer })).body.version).toBe(0)
    expect((await api<RevisionSummaryDto[]>(`/api/studies/${studyId}/revisions`, { cookie: engineer })).body).toEqual([])
  })

  it('saves revision 1 and 2 in turn, with the engine defaults filled, and moves the study to the head', async () => {
    const first = await save({ baseVersion: 0, spec: SPEC, process: PROCESS, options: OPTIONS })
    expect(first.status).toBe(201)
    expect(first.body).toMatchObject({ number: 1, hasResults: false, results: null, author: { name: 'Priya Okafor' } })
    expect(first.body.process).toMatchObject({ ...PROCESS, unitOhm: 'auto' })
    const second = await save({ baseVersion: 1, spec: { ...SPEC, vrefV: 3.3 }, process: PROCESS, options: OPTIONS, note: 'Raised the reference' }, architect)
    expect(second.body.number).toBe(2)
    const study = await api<StudyDto>(`/api/studies/${studyId}`, { cookie: manager })
    expect(study.body).toMatchObject({ version: 2, title: 'Revision test study', status: 'draft' })
    expect(study.body.spec.vrefV).toBe(3.3)
    const list = await api<RevisionSummaryDto[]>(`/api/studies/${studyId}/revisions`, { cookie: manager })
    expect(list.body.map(r => r.number)).toEqual([2, 1])
    expect(await db('audit_log').where({ action: 'revision_saved', target_id: String(studyId) })).toHaveLength(2)
  })

  it('answers a stale base version with 409 and the current version, and writes nothing', async () => {
    const before = await revisionCount()
    const res = await save({ baseVersion: 1, spec: SPEC, process: PROCESS, options: OPTIONS })
    expect(res.status).toBe(409)
    expect(res.body.data.currentVersion).toBe(2)
    expect(res.body.message).toMatch(/^baseVersion: /)
    expect(await revisionCount()).toBe(before)
  })

  it('lets only one of two concurrent saves on the same base version win', async () => {
    const [a, b] = await Promise.all([
      save({ baseVersion: 2, spec: SPEC, process: PROCESS, options: OPTIONS }),
      save({ baseVersion: 2, spec: { ...SPEC, bits: 10 }, process: PROCESS, options: OPTIONS }, architect)
    ])
    expect([a.status, b.status].sort()).toEqual([201, 409])
    expect(await revisionCount()).toBe(3)
  })

  it.each([
    ['a spec out of range', { spec: { ...SPEC, bits: 40 } }, 'spec.bits'],
    ['a process without its matching data', { process: { sheetOhmPerSq: 300 } }, 'process.matchingPctUm'],
    ['too many Monte Carlo trials for 16 bits', { spec: { ...SPEC, bits: 16 }, options: { trials: 100_000 } }, 'options.trials'],
    ['an unknown field', { title: 'renamed' }, 'title'],
    ['a missing base version', { baseVersion: undefined }, 'baseVersion']
  ])('answers %s with 400 naming the field, and writes nothing', async (_label, patch, path) => {
    const before = await revisionCount()
    const res = await save({ baseVersion: 3, spec: SPEC, process: PROCESS, options: OPTIONS, ...patch })
    expect(res.status).toBe(400)
    expect(res.body.data.issues.map(i => i.path)).toContain(path)
    expect(await revisionCount()).toBe(before)
    expect((await api<StudyDto>(`/api/studies/${studyId}`, { cookie: engineer })).body.version).toBe(3)
  })

  it('forbids a manager from saving (403) but lets them read every revision', async () => {
    expect((await save({ baseVersion: 3, spec: SPEC, process: PROCESS, options: OPTIONS }, manager)).status).toBe(403)
    const one = await api<RevisionDto>(`/api/studies/${studyId}/revisions/1`, { cookie: manager })
    expect(one.status).toBe(200)
    expect(one.body.spec.vrefV).toBe(2.5)
  })

  it('keeps teams apart: another team gets 404 for our study\'s revisions and cannot save one', async () => {
    expect((await api(`/api/studies/${studyId}/revisions`, { cookie: otherTeam })).status).toBe(404)
    expect((await api(`/api/studies/${studyId}/revisions/1`, { cookie: otherTeam })).status).toBe(404)
    expect((await api(`/api/studies/${studyId}/revisions/compare?from=1&to=2`, { cookie: otherTeam })).status).toBe(404)
    expect((await save({ baseVersion: 3, spec: SPEC, process: PROCESS, options: OPTIONS }, otherTeam)).status).toBe(404)
    expect((await api(`/api/studies/${studyId}/revisions/99`, { cookie: engineer })).status).toBe(404)
  })

  it('compares two revisions field by field', async () => {
    const res = await api<RevisionCompareDto>(`/api/studies/${studyId}/revisions/compare?from=1&to=2`, { cookie: manager })
    expect(res.status).toBe(200)
    expect(res.body.inputs).toEqual([{ section: 'spec', field: 'vrefV', from: 2.5, to: 3.3 }])
    expect(res.body.results).toBeNull()
    expect((await api(`/api/studies/${studyId}/revisions/compare?from=1`, { cookie: manager })).status).toBe(400)
  })
})

describe('revisions with results from an evaluation', () => {
  async function evaluation(input: object, result: object | null, status = 'done', team?: number) {
    const user = await db('users').where({ email: DEMO.engineer }).first('id', 'team_id')
    const [id] = await db('evaluations').insert({ team_id: team ?? user.team_id, user_id: user.id, status, tasks_total: 1, tasks_done: 1, input: JSON.stringify(input), result: result && JSON.stringify(result), engine_version: 'fixture-engine' })
    return id!
  }

  it('copies the results of a finished evaluation of the same inputs, and compares metrics per candidate', async () => {
    const head = (await api<StudyDto>(`/api/studies/${studyId}`, { cookie: engineer })).body.version
    const input = { spec: SPEC, process: PROCESS, options: OPTIONS }
    const e1 = await evaluation(input, fixtureOutput(1))
    const r1 = await save({ baseVersion: head, ...input, evaluationId: e1 })
    expect(r1.status).toBe(201)
    expect(r1.body).toMatchObject({ hasResults: true, engineVersion: 'fixture-engine', evaluationId: e1, results: fixtureOutput(1) })
    const e2 = await evaluation(input, fixtureOutput(2))
    const r2 = await save({ baseVersion: head + 1, ...input, evaluationId: e2 })
    const cmp = await api<RevisionCompareDto>(`/api/studies/${studyId}/revisions/compare?from=${r1.body.number}&to=${r2.body.number}`, { cookie: engineer })
    expect(cmp.body.inputs).toEqual([])
    // Metric i has value i·scale: every metric but the first (0) differs, in both candidates.
    expect(cmp.body.results?.changed).toHaveLength(2 * (REQUIRED_METRICS.length - 1))
    expect(cmp.body.results?.changed).toContainEqual({ candidate: 'string', metric: REQUIRED_METRICS[1], from: 1, to: 2 })
  })

  it('refuses an evaluation of other inputs, an unfinished one, or another team\'s (400), and writes nothing', async () => {
    const head = (await api<StudyDto>(`/api/studies/${studyId}`, { cookie: engineer })).body.version
    const [otherTeamId] = await db('teams').insert({ name: 'Eval Other', slug: `eval-other-${Date.now()}` })
    const input = { spec: SPEC, process: PROCESS, options: OPTIONS }
    const ids = [
      await evaluation({ ...input, spec: { ...SPEC, bits: 8 } }, fixtureOutput(1)),
      await evaluation(input, null, 'running'),
      await evaluation(input, fixtureOutput(1), 'done', otherTeamId)
    ]
    const before = await revisionCount()
    for (const evaluationId of ids) {
      const res = await save({ baseVersion: head, ...input, evaluationId })
      expect(res.status).toBe(400)
      expect(res.body.data.issues.map(i => i.path)).toEqual(['evaluationId'])
    }
    expect(await revisionCount()).toBe(before)
  })

  it('keeps the ranking weights with the revision it saves, and the defaults when none are sent', async () => {
    const head = (await api<StudyDto>(`/api/studies/${studyId}`, { cookie: engineer })).body.version
    const weights = { area: 6, yieldMargin: 0, glitch: 2.5, referenceLoad: 1, settlingMargin: 0, power: 0, complexity: 4 }
    const saved = await save({ baseVersion: head, spec: SPEC, process: PROCESS, options: OPTIONS, weights })
    expect(saved.status).toBe(201)
    expect(saved.body.weights).toEqual(weights)
    const read = await api<RevisionDto>(`/api/studies/${studyId}/revisions/${saved.body.number}`, { cookie: manager })
    expect(read.body.weights).toEqual(weights)
    // a partial set is completed with the defaults (shared/findings/weights.ts: area 3, yield margin 2, the rest 1)
    const partial = await save({ baseVersion: saved.body.number, spec: SPEC, process: PROCESS, options: OPTIONS, weights: { glitch: 5 } })
    expect(partial.body.weights).toEqual({ area: 3, yieldMargin: 2, glitch: 5, referenceLoad: 1, settlingMargin: 1, power: 1, complexity: 1 })
    const none = await save({ baseVersion: partial.body.number, spec: SPEC, process: PROCESS, options: OPTIONS })
    expect(none.body.weights).toEqual({ area: 3, yieldMargin: 2, glitch: 1, referenceLoad: 1, settlingMargin: 1, power: 1, complexity: 1 })
  })

  it('refuses weights out of range, unknown criteria or all zero with a field-named 400, and writes nothing', async () => {
    const head = (await api<StudyDto>(`/api/studies/${studyId}`, { cookie: engineer })).body.version
    const before = await revisionCount()
    const zero = { area: 0, yieldMargin: 0, glitch: 0, referenceLoad: 0, settlingMargin: 0, power: 0, complexity: 0 }
    const cases: Array<[unknown, string, string]> = [
      [{ area: 11 }, 'weights.area', 'must be a number from 0 to 10'],
      [{ glitch: -1 }, 'weights.glitch', 'must be a number from 0 to 10'],
      [{ power: 'high' }, 'weights.power', 'must be a number from 0 to 10'],
      [{ beauty: 2 }, 'weights.beauty', 'beauty'],
      [zero, 'weights', 'at least one weight must be above 0']
    ]
    for (const [weights, path, words] of cases) {
      const r = await save({ baseVersion: head, spec: SPEC, process: PROCESS, options: OPTIONS, weights })
      expect(r.status).toBe(400)
      expect(r.body.data.issues.map(i => i.path)).toContain(path)
      expect(r.body.message).toContain(words)
    }
    expect(await revisionCount()).toBe(before)
  })
})
