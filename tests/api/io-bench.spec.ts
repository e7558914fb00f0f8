import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { BenchComparisonDto, BenchMeasurementDto } from '../../shared/types/bench'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'
import { runNgspice } from '../support/ngspice'

const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair', switchOhm: 50 }
const spec = (bits: number) => ({ bits, vrefV: 1.2, updateRateHz: 1e6, loadCapacitanceF: 1e-12, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 })

let db: Knex
let engineer: string
let manager: string
let otherTeam: string

type Bad = { message: string, data: { lines: { line: number | null, message: string }[], total: number } }
const benchCount = async () => Number((await db('bench_measurements').count({ n: '*' }))[0]!.n)
const upload = <T = BenchMeasurementDto>(studyId: number, candidateId: string, text: string, cookie = engineer) =>
  api<T>(`/api/studies/${studyId}/bench`, { method: 'POST', cookie, body: { candidateId, fileName: 'bench.csv', text } })

async function study(bits: number, options: Record<string, unknown> = { topologies: ['r2r-voltage', 'segmented'], trials: 0 }): Promise<number> {
  const res = await api<{ studies: { id: number }[] }>('/api/studies/import', { method: 'POST', cookie: engineer, body: { text: JSON.stringify([{ title: `Bench ${bits}-bit`, spec: spec(bits), process: PROCESS, options }]) } })
  expect(res.status).toBe(201)
  return res.body.studies[0]!.id
}

beforeAll(async () => {
  db = testDb()
  ;[engineer, manager] = await Promise.all([signIn(DEMO.engineer), signIn(DEMO.manager)])
  const [otherId] = await db('teams').insert({ name: 'Bench Other Works', slug: `bench-other-${Date.now()}` })
  const email = `bench-${Date.now()}@other.example`
  await db('users').insert({ team_id: otherId, email, display_name: 'Other Engineer', password_hash: await bcrypt.hash('other-team-pass', 4), role: 'architect' })
  otherTeam = await signIn(email, 'other-team-pass')
})
afterAll(async () => {
  await db.destroy()
})

describe('bench data upload', () => {
  it('reports malformed lines by number and stores nothing', async () => {
    const id = await study(2)
    const before = await benchCount()
    const res = await upload<Bad>(id, 'r2r-voltage', '# bench\ncode,voltage\n0,0\n1,0.3x\n1,0.3\n1,0.31\n7,1\n')
    expect(res.status).toBe(400)
    expect(res.body.data.lines).toEqual([
      { line: 4, message: 'the voltage of code 1 must be a number (got "0.3x")' },
      { line: 6, message: 'code 1 appears again (first on line 5)' },
      { line: 7, message: 'code 7 is outside 0 to 3 of a 2-bit study' }
    ])
    expect(res.body.message).toMatch(/^text: bench\.csv: 3 problems, nothing was stored\. line 4: /)
    const short = await upload<Bad>(id, 'r2r-voltage', '0,0\n1,0.3\n2,0.6\n')
    expect(short.body.data.lines).toEqual([{ line: null, message: 'the file has 3 codes; a 2-bit study needs all 4 codes 0 to 3: code 3 missing' }])
    expect(await benchCount()).toBe(before)
  })

  it('stores a valid file with the INL/DNL of the hand-worked example (IEEE Std 1658 definitions, MODELS.md §1)', async () => {
    const id = await study(3, { topologies: ['r2r-voltage'], trials: 0 })
    const res = await upload(id, 'r2r-voltage', 'code,voltage\n0,0\n1,1\n2,2.1\n3,2.9\n4,4.2\n5,5\n6,5.8\n7,7\n')
    expect(res.status).toBe(201)
    // by hand: endpoint INL max 0.2 at code 4, DNL max 0.3 at code 3; best-fit INL max 17.3/83 (see tests/unit/shared/io/benchCsv.spec.ts)
    expect(res.body.summary.endpoint.inlMaxLsb).toBeCloseTo(0.2, 12)
    expect(res.body.summary.endpoint.dnlMaxLsb).toBeCloseTo(0.3, 12)
    expect(res.body.summary.bestFit.inlMaxLsb).toBeCloseTo(17.3 / 83, 12)
    expect(res.body).toMatchObject({ candidateId: 'r2r-voltage', revisionNumber: 1, quantity: 'voltage', bits: 3, fileName: 'bench.csv' })
    const list = await api<BenchMeasurementDto[]>(`/api/studies/${id}/bench`, { cookie: manager })
    expect(list.body.map(b => b.id)).toEqual([res.body.id])
    expect(await db('audit_log').where({ action: 'bench_uploaded', target_id: String(id) })).toHaveLength(1)
  })

  // Issue 13, finding 6: decided studies are read-only except notes, and bench data was accepted.
  it.each(['decided', 'archived'])('refuses an upload to a %s study with 423 and stores nothing', async (status) => {
    const id = await study(2)
    await db('studies').where({ id }).update({ status })
    const before = await benchCount()
    const res = await upload<{ message: string }>(id, 'r2r-voltage', 'code,voltage\n0,0\n1,1\n2,2\n3,3\n')
    expect(res.status).toBe(423)
    expect(res.body.message).toContain('read-only')
    expect(await benchCount()).toBe(before)
    expect((await api(`/api/studies/${id}/bench`, { cookie: manager })).status).toBe(200)
  })

  it('refuses a manager and another team', async () => {
    const id = await study(2)
    const text = 'code,voltage\n0,0\n1,1\n2,2\n3,3\n'
    expect((await upload(id, 'r2r-voltage', text, manager)).status).toBe(403)
    expect((await upload(id, 'r2r-voltage', text, otherTeam)).status).toBe(404)
    expect((await api(`/api/studies/${id}/bench`, { cookie: otherTeam })).status).toBe(404)
    expect((await upload<Bad>(id, 'segmented-m5', text)).body.message).toMatch(/^candidateId: /)
  })
})

describe('netlist download run in ngspice, measured INL/DNL against the engine', () => {
  it('a Monte Carlo sample: ngspice\'s transfer gives the same INL/DNL as the engine\'s solve of the same circuit', async () => {
    const id = await study(6)
    const res = await api<string>(`/api/studies/${id}/netlist?candidate=segmented-m2&seed=11&index=4`, { cookie: manager })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-disposition')).toMatch(/segmented-m2-seed11-index4\.cir"$/)
    // ngspice (Debian package) is the outside solver; the netlist runs unchanged
    const dc = runNgspice(res.body, ['rungwise-dc.txt']).files['rungwise-dc.txt']!
    expect(dc.rows).toHaveLength(64)
    const measured = await upload(id, 'segmented-m2', `# ngspice run\ncode,voltage\n${dc.rows.map(([code, v]) => `${code},${v}`).join('\n')}\n`)
    expect(measured.status).toBe(201)
    // the engine's exact solve of the same circuit (POST /api/netlist returns it, POST /api/solve solves it)
    const exported = await api<{ circuit: unknown }>('/api/netlist', { method: 'POST', cookie: engineer, body: { spec: spec(6), process: PROCESS, candidate: { topology: 'segmented', unaryBits: 2 }, sample: { seed: 11, index: 4 } } })
    const solved = await api<{ codes: { code: number, voutV: number }[] }>('/api/solve', { method: 'POST', cookie: engineer, body: exported.body.circuit })
    const engine = await upload(id, 'segmented-m2', solved.body.codes.map(c => `${c.code},${c.voutV}`).join('\n'))
    for (const def of ['endpoint', 'bestFit'] as const) {
      for (const key of ['inlMaxLsb', 'inlMinLsb', 'dnlMaxLsb', 'dnlMinLsb'] as const) {
        expect(Math.abs(measured.body.summary[def][key] - engine.body.summary[def][key])).toBeLessThan(1e-6)
      }
      expect(measured.body.summary[def].inlMaxCode).toBe(engine.body.summary[def].inlMaxCode)
    }
    // a mismatched sample is not the ideal line (the check could fail)
    expect(measured.body.summary.endpoint.inlAbsLsb).toBeGreaterThan(1e-4)
  })

  it('the nominal netlist: ngspice\'s INL equals the prediction the bench view shows', async () => {
    const id = await study(5)
    const res = await api<string>(`/api/studies/${id}/netlist?candidate=r2r-voltage`, { cookie: engineer })
    const dc = runNgspice(res.body, ['rungwise-dc.txt']).files['rungwise-dc.txt']!
    const up = await upload(id, 'r2r-voltage', dc.rows.map(([code, v]) => `${code},${v}`).join('\n'))
    const view = await api<BenchComparisonDto>(`/api/studies/${id}/bench/${up.body.id}`, { cookie: manager })
    expect(view.status).toBe(200)
    expect(Math.abs(view.body.summary.endpoint.inlMaxLsb - view.body.predicted.endpoint.inlMaxLsb)).toBeLessThan(1e-6)
    expect(Math.abs(view.body.summary.bestFit.dnlMinLsb - view.body.predicted.bestFit.dnlMinLsb)).toBeLessThan(1e-6)
    expect(view.body.measured.codes).toHaveLength(32)
    expect(view.body.envelope).toBeNull()
  })

  it('refuses a sample half given and an unknown candidate, and a netlist above the size limit with 413', async () => {
    const id = await study(6)
    expect((await api<{ message: string }>(`/api/studies/${id}/netlist?candidate=r2r-voltage&seed=1`, { cookie: engineer })).status).toBe(400)
    expect((await api<{ message: string }>(`/api/studies/${id}/netlist?candidate=segmented-m9`, { cookie: engineer })).body.message).toMatch(/^candidate: /)
    const big = await study(16, { topologies: ['string'], trials: 0 })
    const res = await api<{ message: string }>(`/api/studies/${big}/netlist?candidate=string-direct`, { cookie: engineer })
    expect(res.status).toBe(413)
    expect(res.body.message).toMatch(/above the 16 MB download limit/)
    // refused before building: 2^16 codes × at least 500 B (measured 546–608 B per code, 8–14 bits)
    expect(res.body.message).toMatch(/at least 31\.3 MB/)
    // 15 bits: the lower bound (15.6 MB) is under the limit, so it is built on the pool and refused there
    const mid = await study(15, { topologies: ['string'], trials: 0 })
    const built = await api<{ message: string }>(`/api/studies/${mid}/netlist?candidate=string-direct`, { cookie: engineer })
    expect(built.status).toBe(413)
    expect(built.body.message).not.toMatch(/at least/)
  }, 120_000)
})
