import { spawnSync } from 'node:child_process'
import { randomBytes } from 'node:crypto'
import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { CliIo } from '../../scripts/cli/io'
import { runCli } from '../../scripts/cli/run'
import { freePort } from '../support/mariadb'
import { testDb } from '../support/db'
import { api, signIn } from '../support/http'

/**
 * `npm run cli -- --server URL …` against the test server, run in-process (one spawn as a smoke
 * test): each command, each exit code (0 ok, 2 bad input, 3 refused, 4 unreachable), and the same
 * JSON as the local engine for the same document (the contract is one; common practice, no source).
 */
let db: Knex
const tokens = { all: '', read: '', other: '' }
let studyId = 0
let otherStudyId = 0
const SPEC = { bits: 6, vrefV: 1, updateRateHz: 1e6, loadCapacitanceF: 1e-12, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }
const INPUTS = { spec: SPEC, process: { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }, options: { topologies: ['r2r-voltage', 'string'], trials: 100, seed: 7 } }
const LADDER = { topology: 'r2r-voltage', bits: 3, vrefV: 1, legsOhm: [2e4, 2e4, 2e4], seriesOhm: [1e4, 1e4], terminationOhm: 2e4 }

interface Run { code: number, out: string, err: string, json: () => Record<string, unknown> }

async function cli(argv: string[], opts: { token?: string, files?: Record<string, unknown>, server?: string | null } = {}): Promise<Run> {
  let out = ''
  let err = ''
  const io: CliIo = {
    stdout: (t) => { out += t },
    stderr: (t) => { err += t },
    read: (source) => {
      const v = opts.files?.[source]
      if (v === undefined) throw Object.assign(new Error('no such file'), { code: 'ENOENT' })
      return typeof v === 'string' ? v : JSON.stringify(v)
    },
    env: { RUNGWISE_TOKEN: opts.token, RUNGWISE_POLL_MS: '100' },
    fetch: globalThis.fetch,
    sleep: ms => new Promise(r => setTimeout(r, ms))
  }
  const server = opts.server === undefined ? inject('baseUrl') : opts.server
  const code = await runCli(server === null ? argv : ['--server', server, ...argv], io)
  return { code, out, err, json: () => JSON.parse(out) }
}

async function teamWithToken(tag: string) {
  const stamp = `${Date.now()}-${randomBytes(3).toString('hex')}`
  const [teamId] = await db('teams').insert({ name: `CLI ${tag}`, slug: `cli-${tag}-${stamp}` })
  const email = `cli-${tag}-${stamp}@cli.example`
  await db('users').insert({ team_id: teamId, email, display_name: `CLI ${tag}`, password_hash: await bcrypt.hash('cli-team-password', 4), role: 'engineer' })
  const cookie = await signIn(email, 'cli-team-password')
  const token = async (scopes: string[]) => (await api<{ token: string }>('/api/tokens', { method: 'POST', cookie, body: { name: `CLI ${scopes.join(' ')}`, scopes, expiresInDays: 1 } })).body.token
  const study = await api<{ id: number }>('/api/studies', { method: 'POST', cookie, body: { title: `CLI study ${tag}`, spec: SPEC } })
  return { token, studyId: study.body.id }
}

beforeAll(async () => {
  db = testDb()
  const own = await teamWithToken('own')
  tokens.all = await own.token(['read', 'write', 'evaluate'])
  tokens.read = await own.token(['read'])
  studyId = own.studyId
  const other = await teamWithToken('other')
  tokens.other = await other.token(['read'])
  otherStudyId = other.studyId
})
afterAll(async () => {
  await db.destroy()
})

describe('CLI against a server', () => {
  it('solve, evaluate and netlist print the same JSON as the local engine', async () => {
    for (const [command, doc] of [['solve', LADDER], ['netlist', { circuit: LADDER }], ['netlist', { circuit: LADDER, deck: 'portable' }], ['evaluate', INPUTS]] as const) {
      const remote = await cli([command, 'in.json'], { token: tokens.all, files: { 'in.json': doc } })
      expect(remote.code, remote.err).toBe(0)
      const local = await cli([command, 'in.json'], { files: { 'in.json': doc }, server: null })
      expect(local.code, local.err).toBe(0)
      expect(remote.json()).toEqual(local.json())
    }
  })

  it('saves revisions, with an evaluation job\'s results, lists studies and fetches the latest results', async () => {
    const plain = await cli(['study', 'save', String(studyId), 'rev.json'], { token: tokens.all, files: { 'rev.json': { ...INPUTS, note: 'from the CLI' } } })
    expect(plain.code, plain.err).toBe(0)
    expect(plain.json()).toMatchObject({ number: 1, hasResults: false, note: 'from the CLI' })
    expect((await cli(['study', 'results', String(studyId)], { token: tokens.all })).code).toBe(3)
    const evaluated = await cli(['study', 'save', String(studyId), 'rev.json', '--evaluate'], { token: tokens.all, files: { 'rev.json': INPUTS } })
    expect(evaluated.code, evaluated.err).toBe(0)
    expect(evaluated.json()).toMatchObject({ number: 2, hasResults: true })
    const list = await cli(['study', 'list', '--page-size', '100'], { token: tokens.read })
    expect(list.code, list.err).toBe(0)
    expect((list.json().items as { id: number, version: number }[]).find(s => s.id === studyId)?.version).toBe(2)
    const results = await cli(['study', 'results', String(studyId), '--pretty'], { token: tokens.read })
    expect(results.code, results.err).toBe(0)
    const local = await cli(['evaluate', 'in.json'], { files: { 'in.json': INPUTS }, server: null })
    expect(results.json()).toMatchObject({ studyId, revision: 2 })
    expect((results.json().results as { candidates: unknown[] }).candidates).toEqual(local.json().candidates)
  })

  it('exits 2 on bad input, locally or as the server words it', async () => {
    const bad = await cli(['evaluate', 'in.json'], { token: tokens.all, files: { 'in.json': { ...INPUTS, spec: { ...SPEC, bits: 40 } } } })
    expect(bad.code).toBe(2)
    expect(bad.err).toMatch(/^400: spec\.bits: must be an integer from 2 to 16/)
    expect((await cli(['solve', 'in.json'], { token: tokens.all, files: { 'in.json': '{ not json' } })).code).toBe(2)
    expect((await cli(['solve', 'missing.json'], { token: tokens.all })).code).toBe(2)
    expect((await cli(['study', 'list'], { token: tokens.all, server: 'ftp://example.invalid' })).code).toBe(2)
    expect((await cli(['study', 'results', 'abc'], { token: tokens.all })).code).toBe(2)
    expect((await cli(['study', 'list'], { token: tokens.all, server: null })).code).toBe(2)
  })

  it('exits 3 when the server refuses: no token, a scope short, another team\'s study, a stale base', async () => {
    const none = await cli(['study', 'list'])
    expect(none.code).toBe(3)
    expect(none.err).toContain('RUNGWISE_TOKEN')
    expect((await cli(['solve', 'in.json'], { token: tokens.read, files: { 'in.json': LADDER } })).code).toBe(3)
    expect((await cli(['study', 'results', String(otherStudyId)], { token: tokens.all })).code).toBe(3)
    expect((await cli(['study', 'results', String(studyId)], { token: tokens.other })).code).toBe(3)
    const stale = await cli(['study', 'save', String(studyId), 'rev.json'], { token: tokens.all, files: { 'rev.json': { ...INPUTS, baseVersion: 0 } } })
    expect(stale.code).toBe(3)
    expect(stale.err).toMatch(/^409: baseVersion/)
  })

  it('exits 4 when nothing answers at the address', async () => {
    const port = await freePort()
    const gone = await cli(['study', 'list'], { token: tokens.all, server: `http://127.0.0.1:${port}` })
    expect(gone.code).toBe(4)
    expect(gone.err).toContain('no answer')
    expect(gone.err).not.toContain(tokens.all)
  })

  it('runs as `npm run cli` does (one spawn: tsx, the real process and exit code)', () => {
    const r = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/cli.ts', '--server', inject('baseUrl'), 'study', 'list'], { env: { ...process.env, RUNGWISE_TOKEN: tokens.read }, encoding: 'utf8', timeout: 60_000 })
    expect(r.status, r.stderr).toBe(0)
    expect(JSON.parse(r.stdout).items.length).toBeGreaterThan(0)
  })
})
