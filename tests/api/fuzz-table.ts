import type { Knex } from 'knex'
import { matrixPack } from './authorization-rule-packs'

/**
 * One row per API route for the fuzz spec: who calls, a valid request (path parameters, body, query)
 * that the fuzzer mutates, and the tables a refused request must leave exactly as they were.
 * A route file without a row fails tests/api/fuzz.spec.ts; a new route means one new row here.
 */
export interface FuzzFixtures {
  db: Knex
  studyId: number
  presetId: number
  templateId: number
  packRowId: number
  packId: string
  jobId: number
  invitationToken: string
  /**
   * Fresh fixtures, made when a row's sample is built (so no earlier row's path mutations can have
   * changed them): a note by the admin on studyId (resolved when asked), an attachment on a fresh
   * note, a study of the admin's team whose revision 1 has results for candidate r2r-voltage (in the
   * status asked; in review with the demo architect assigned, signed off by them when asked), a bench row on it.
   */
  note: (resolved?: boolean) => Promise<number>
  attachment: () => Promise<number>
  study: (status?: 'draft' | 'in_review' | 'signed_off' | 'decided') => Promise<{ id: number, signOffId: number | null }>
  bench: (studyId: number) => Promise<number>
  /** a fresh engineer of the fuzz team */
  member: () => Promise<number>
  /** a fresh API token of the fuzz admin: its row id and the token (every scope) */
  token: () => Promise<{ id: number, token: string }>
  architectId: number
}

export interface FuzzSample {
  params?: Record<string, string>
  body?: unknown
  query?: Record<string, string>
}

export interface FuzzRow {
  route: string
  /**
   * admin and architect of the fuzz spec's own team (see fuzzTeam in fuzz.spec.ts), or no session;
   * adminToken: the admin through a fresh API token of every scope (Authorization: Bearer, no cookie)
   */
  as: 'admin' | 'architect' | 'signedOut' | 'adminToken'
  sample: (f: FuzzFixtures) => FuzzSample | Promise<FuzzSample>
  /** tables compared with CHECKSUM TABLE before and after every refused request */
  tables: string[]
  /** when set, the unmutated sample is sent once first and must get this status (so the fuzzer mutates a request that works) */
  accepts?: number
  /** runs relative to the default (heavy routes get fewer) */
  weight?: number
}

export const SPEC = { bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }
const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }
const LADDER = { topology: 'r2r-voltage', bits: 3, vrefV: 1, legsOhm: [2e4, 2e4, 2e4], seriesOhm: [1e4, 1e4], terminationOhm: 2e4 }
const EVALUATE = { spec: SPEC, process: PROCESS, options: { topologies: ['r2r-voltage'], trials: 20, seed: 1 } }

const STUDY_TABLES = ['studies', 'study_revisions', 'audit_log']
const PRESET_TABLES = ['process_presets', 'audit_log']
const TEMPLATE_TABLES = ['spec_templates', 'audit_log']
const PACK_TABLES = ['rule_packs', 'rule_pack_versions', 'audit_log']
const id = (n: number) => ({ id: String(n) })
const unique = () => `Fuzz ${Date.now()} ${Math.floor(Math.random() * 1e9)}`

async function revisionBody(f: FuzzFixtures) {
  const study = await f.db('studies').where({ id: f.studyId }).first('version')
  return { baseVersion: study.version, spec: SPEC, process: PROCESS, options: { topologies: ['string'], trials: 0, seed: 1 }, note: 'fuzz' }
}

async function packVersion(f: FuzzFixtures): Promise<number> {
  return (await f.db('rule_packs').where({ id: f.packRowId }).first('version')).version
}

const TOKEN_TABLES = ['api_tokens', 'audit_log']
const NOTE_TABLES = ['notes', 'note_mentions', 'note_attachments', 'audit_log']
const REVIEW_TABLES = ['studies', 'study_reviews', 'study_decisions', 'audit_log']
/** mail_outbox is left out: the delivery worker updates rows queued by an earlier accepted request at any time. */
const IMPORT_CSV = `title,bits,vrefV,updateRateHz,loadCapacitanceF,inlTargetLsb,dnlTargetLsb,yieldTarget,areaBudgetMm2,glitchLimitVs,powerBudgetW,sheetOhmPerSq,matchingPctUm,matchingConvention
Fuzz import,8,2.5 V,1 MS/s,1 pF,0.5,0.5,99 %,0.05,100 pV·s,1 mW,1 kΩ,1 %·µm,pair
`
/** An ideal 4-bit transfer: the fuzzer's input, not a checked result (io-bench.spec.ts checks the numbers). */
const BENCH_CSV = `code,voltage\n${Array.from({ length: 16 }, (_, k) => `${k},${k / 16}`).join('\n')}\n`

const PORTFOLIO_QUERY = { page: '1', pageSize: '25', status: 'all', q: 'demo', sort: 'updated', dir: 'desc' }

export const FUZZ_TABLE: FuzzRow[] = [
  { route: 'GET /api/health', as: 'signedOut', sample: () => ({}), tables: [] },
  { route: 'GET /api/openapi.json', accepts: 200, as: 'signedOut', sample: () => ({}), tables: [], weight: 0.25 },
  { route: 'POST /api/auth/login', as: 'signedOut', sample: () => ({ body: { email: 'fuzz@nowhere.example', password: 'not-the-password' } }), tables: ['sessions', 'users'] },
  { route: 'POST /api/auth/logout', as: 'signedOut', sample: () => ({ body: {} }), tables: ['users'] },
  { route: 'GET /api/auth/session', as: 'adminToken', sample: () => ({}), tables: [] },
  { route: 'GET /api/studies', as: 'adminToken', sample: () => ({ query: { page: '1', pageSize: '25' } }), tables: [] },
  { route: 'POST /api/studies', as: 'admin', sample: () => ({ body: { title: unique(), blockName: 'DAC0', spec: SPEC } }), tables: STUDY_TABLES },
  { route: 'GET /api/studies/:id', as: 'admin', sample: f => ({ params: id(f.studyId) }), tables: [] },
  { route: 'GET /api/studies/:id/revisions', as: 'admin', sample: f => ({ params: id(f.studyId) }), tables: [] },
  { route: 'POST /api/studies/:id/revisions', as: 'adminToken', sample: async f => ({ params: id(f.studyId), body: await revisionBody(f) }), tables: STUDY_TABLES },
  { route: 'GET /api/studies/:id/revisions/:n', as: 'admin', sample: f => ({ params: { id: String(f.studyId), n: '1' } }), tables: [] },
  { route: 'GET /api/studies/:id/revisions/compare', as: 'admin', sample: f => ({ params: id(f.studyId), query: { from: '1', to: '1' } }), tables: [] },
  { route: 'POST /api/solve', as: 'admin', sample: () => ({ body: LADDER }), tables: [] },
  { route: 'POST /api/netlist', as: 'admin', sample: () => ({ body: { circuit: LADDER } }), tables: [] },
  { route: 'POST /api/evaluate', as: 'admin', sample: () => ({ body: EVALUATE }), tables: [], weight: 0.5 },
  { route: 'POST /api/evaluations', as: 'adminToken', sample: () => ({ body: EVALUATE }), tables: [], weight: 0.5 },
  { route: 'GET /api/evaluations/:id', as: 'admin', sample: f => ({ params: id(f.jobId), query: { result: '0' } }), tables: [] },
  { route: 'DELETE /api/evaluations/:id', as: 'admin', sample: f => ({ params: id(f.jobId) }), tables: [] },
  { route: 'GET /api/presets', as: 'admin', sample: () => ({}), tables: [] },
  { route: 'POST /api/presets', as: 'admin', sample: () => ({ body: { name: unique(), description: 'fuzz', process: PROCESS } }), tables: PRESET_TABLES },
  { route: 'PATCH /api/presets/:id', as: 'admin', sample: async f => ({ params: id(f.presetId), body: { version: (await f.db('process_presets').where({ id: f.presetId }).first('version')).version, name: unique(), description: 'fuzz', process: PROCESS } }), tables: PRESET_TABLES },
  { route: 'DELETE /api/presets/:id', as: 'admin', sample: () => ({ params: { id: '2147483000' }, query: { version: '1' } }), tables: PRESET_TABLES },
  { route: 'GET /api/templates', as: 'admin', sample: () => ({}), tables: [] },
  { route: 'POST /api/templates', as: 'admin', sample: () => ({ body: { name: unique(), description: 'fuzz', spec: SPEC } }), tables: TEMPLATE_TABLES },
  { route: 'PATCH /api/templates/:id', as: 'admin', sample: async f => ({ params: id(f.templateId), body: { version: (await f.db('spec_templates').where({ id: f.templateId }).first('version')).version, name: unique(), spec: SPEC } }), tables: TEMPLATE_TABLES },
  { route: 'DELETE /api/templates/:id', as: 'admin', sample: () => ({ params: { id: '2147483000' }, query: { version: '1' } }), tables: TEMPLATE_TABLES },
  { route: 'GET /api/rule-packs', as: 'admin', sample: () => ({}), tables: [] },
  { route: 'POST /api/rule-packs', as: 'admin', sample: () => ({ body: { pack: matrixPack('fuzz'), enabled: false } }), tables: PACK_TABLES },
  { route: 'GET /api/rule-packs/:id', as: 'admin', sample: f => ({ params: id(f.packRowId) }), tables: [] },
  { route: 'GET /api/rule-packs/:id/history', as: 'admin', sample: f => ({ params: id(f.packRowId) }), tables: [] },
  { route: 'PATCH /api/rule-packs/:id', as: 'admin', sample: async f => ({ params: id(f.packRowId), body: { version: await packVersion(f), enabled: false, pack: { ...matrixPack('fuzz'), id: f.packId } } }), tables: PACK_TABLES },
  { route: 'POST /api/rule-packs/:id/dry-run', as: 'admin', sample: f => ({ params: id(f.packRowId), body: { input: EVALUATE } }), tables: PACK_TABLES, weight: 0.5 },
  { route: 'POST /api/rule-packs/dry-run', as: 'admin', sample: () => ({ body: { pack: matrixPack('fuzz'), input: EVALUATE } }), tables: PACK_TABLES, weight: 0.5 },
  { route: 'GET /api/team', as: 'admin', sample: () => ({}), tables: [] },
  { route: 'POST /api/team/invitations', as: 'admin', sample: () => ({ body: { email: `fuzz-${Date.now()}-${Math.floor(Math.random() * 1e9)}@invite.example`, name: 'Fuzz Invitee', role: 'engineer' } }), tables: ['invitations', 'users', 'audit_log'] },
  { route: 'PATCH /api/team/members/:id', accepts: 200, as: 'admin', sample: async f => ({ params: id(await f.member()), body: { role: 'architect', active: true } }), tables: ['users', 'sessions', 'audit_log'] },
  { route: 'GET /api/invitations/:token', as: 'signedOut', sample: f => ({ params: { token: f.invitationToken } }), tables: [] },
  { route: 'POST /api/invitations/:token/accept', as: 'signedOut', sample: f => ({ params: { token: f.invitationToken }, body: { password: 'a-long-enough-password' } }), tables: ['invitations', 'users', 'audit_log'] },
  { route: 'GET /api/admin/mail', as: 'admin', sample: () => ({}), tables: [] },
  { route: 'GET /api/portfolio', as: 'admin', sample: () => ({ query: PORTFOLIO_QUERY }), tables: [] },
  { route: 'GET /api/portfolio/export', as: 'admin', sample: () => ({ query: PORTFOLIO_QUERY }), tables: [], weight: 0.5 },

  // notes and attachments
  { route: 'GET /api/studies/:id/notes', accepts: 200, as: 'admin', sample: f => ({ params: id(f.studyId) }), tables: [] },
  { route: 'POST /api/studies/:id/notes', accepts: 201, as: 'admin', sample: f => ({ params: id(f.studyId), body: { body: 'Fuzz note with **bold** and @architect' } }), tables: NOTE_TABLES },
  { route: 'PATCH /api/notes/:id', accepts: 200, as: 'admin', sample: async f => ({ params: id(await f.note()), body: { version: 1, body: 'Fuzz edit' } }), tables: NOTE_TABLES },
  { route: 'POST /api/notes/:id/resolve', accepts: 200, as: 'admin', sample: async f => ({ params: id(await f.note()), body: {} }), tables: NOTE_TABLES },
  { route: 'POST /api/notes/:id/reopen', accepts: 200, as: 'admin', sample: async f => ({ params: id(await f.note(true)), body: {} }), tables: NOTE_TABLES },
  {
    // Multipart only: the harness sends JSON bodies, so every body mutation must get a 4xx (411/413/415/400)
    // and leave the tables alone; the path parameter is fuzzed as for any route. The accepted upload
    // itself is covered by notes-attachments specs and the authorization matrix.
    route: 'POST /api/notes/:id/attachments', accepts: 415, as: 'admin', sample: async f => ({ params: id(await f.note()), body: {} }), tables: NOTE_TABLES
  },
  { route: 'GET /api/attachments/:id', accepts: 200, as: 'admin', sample: async f => ({ params: id(await f.attachment()) }), tables: [] },
  { route: 'DELETE /api/notes/:id', accepts: 204, as: 'admin', sample: async f => ({ params: id(await f.note()) }), tables: NOTE_TABLES },

  // imports, exports and bench data
  { route: 'POST /api/studies/import/preview', accepts: 200, as: 'admin', sample: () => ({ body: { text: IMPORT_CSV, format: 'csv' } }), tables: STUDY_TABLES, weight: 0.5 },
  { route: 'POST /api/studies/import', accepts: 201, as: 'admin', sample: () => ({ body: { text: IMPORT_CSV, format: 'csv', fileName: 'fuzz.csv' } }), tables: STUDY_TABLES, weight: 0.5 },
  { route: 'GET /api/studies/:id/export', accepts: 200, as: 'admin', sample: async f => ({ params: id((await f.study()).id) }), tables: [] },
  { route: 'GET /api/studies/:id/comparison', accepts: 200, as: 'admin', sample: async f => ({ params: id((await f.study()).id) }), tables: [] },
  { route: 'GET /api/studies/:id/netlist', accepts: 200, as: 'admin', sample: async f => ({ params: id((await f.study()).id), query: { candidate: 'r2r-voltage', seed: '1', index: '0' } }), tables: [] },
  { route: 'GET /api/studies/:id/bench', accepts: 200, as: 'admin', sample: async f => ({ params: id((await f.study()).id) }), tables: [] },
  { route: 'POST /api/studies/:id/bench', accepts: 201, as: 'admin', sample: async f => ({ params: id((await f.study()).id), body: { candidateId: 'r2r-voltage', fileName: 'fuzz.csv', text: BENCH_CSV } }), tables: ['bench_measurements', 'audit_log'], weight: 0.5 },
  { route: 'GET /api/studies/:id/bench/:benchId', accepts: 200, as: 'admin', sample: async (f) => {
    const study = (await f.study()).id
    return { params: { id: String(study), benchId: String(await f.bench(study)) } }
  }, tables: [] },

  // review, decision, activity and the brief
  { route: 'GET /api/studies/:id/review', accepts: 200, as: 'admin', sample: async f => ({ params: id((await f.study('in_review')).id) }), tables: [] },
  { route: 'GET /api/studies/:id/activity', accepts: 200, as: 'admin', sample: f => ({ params: id(f.studyId) }), tables: [] },
  { route: 'GET /api/studies/:id/brief', accepts: 200, as: 'admin', sample: f => ({ params: id(f.studyId) }), tables: [] },
  { route: 'GET /api/studies/:id/brief.pdf', accepts: 200, as: 'admin', sample: f => ({ params: id(f.studyId) }), tables: [], weight: 0.25 },
  { route: 'POST /api/studies/:id/review-request', accepts: 200, as: 'admin', sample: async f => ({ params: id((await f.study('draft')).id), body: { statusVersion: 0, reviewerIds: [f.architectId] } }), tables: REVIEW_TABLES },
  // Only the assigned architect gives a verdict (an admin gets 403), so this row calls as the demo architect.
  { route: 'POST /api/studies/:id/reviews', accepts: 201, as: 'architect', sample: async f => ({ params: id((await f.study('in_review')).id), body: { statusVersion: 0, verdict: 'signed_off', comment: 'Fuzz sign-off' } }), tables: REVIEW_TABLES },
  {
    route: 'POST /api/studies/:id/decision', accepts: 201,
    as: 'admin',
    sample: async (f) => {
      const { id: study, signOffId } = await f.study('signed_off')
      return { params: id(study), body: { statusVersion: 0, candidateId: 'r2r-voltage', rationale: 'Fuzz decision', revision: 1, signOffIds: [signOffId] } }
    },
    tables: [...REVIEW_TABLES, 'study_revisions']
  },
  { route: 'POST /api/studies/:id/reopen', accepts: 200, as: 'admin', sample: async f => ({ params: id((await f.study('decided')).id), body: { statusVersion: 0 } }), tables: REVIEW_TABLES },
  // API tokens (managed with the session only; the token callers of other rows use them)
  { route: 'GET /api/tokens', accepts: 200, as: 'admin', sample: () => ({}), tables: [] },
  { route: 'POST /api/tokens', accepts: 201, as: 'admin', sample: () => ({ body: { name: unique(), scopes: ['read', 'evaluate'], expiresInDays: 30 } }), tables: TOKEN_TABLES },
  { route: 'DELETE /api/tokens/:id', accepts: 200, as: 'admin', sample: async f => ({ params: id((await f.token()).id) }), tables: TOKEN_TABLES },
  { route: 'POST /api/studies/:id/archive', accepts: 200, as: 'admin', sample: async f => ({ params: id((await f.study('decided')).id), body: { statusVersion: 0 } }), tables: REVIEW_TABLES }
]
