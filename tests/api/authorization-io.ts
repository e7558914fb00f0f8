import type { Fixtures, MatrixRow, Who } from './authorization-table'

/**
 * Matrix rows for imports, exports and bench data. Manager reads and exports, never imports or
 * uploads (issue 6, roles in practice); another team's study answers 404.
 */
const SPEC = { bits: 4, vrefV: 1, updateRateHz: 1e6, loadCapacitanceF: 1e-12, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }
const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }
const OPTIONS = { topologies: ['r2r-voltage'], trials: 0, seed: 1 }
const CSV = `title,bits,vrefV,updateRateHz,loadCapacitanceF,inlTargetLsb,dnlTargetLsb,yieldTarget,areaBudgetMm2,glitchLimitVs,powerBudgetW,sheetOhmPerSq,matchingPctUm,matchingConvention
Matrix import,8,2.5 V,1 MS/s,1 pF,0.5,0.5,99 %,0.05,100 pV·s,1 mW,1 kΩ,1 %·µm,pair
`
/** An ideal 4-bit transfer (authorization only; the numbers are checked in io-bench.spec.ts). */
const BENCH = `code,voltage\n${Array.from({ length: 16 }, (_, k) => `${k},${k / 16}`).join('\n')}\n`

/** Arbitrary metric values in the output contract's shape: these rows check who may download, not physics. */
function fixtureResults() {
  const series = { codes: [0], min: [0], max: [0] }
  const metrics = { resistorCount: 9, totalAreaMm2: 0.01 }
  return { engineVersion: 'matrix', candidates: [{ id: 'r2r-voltage', topology: 'r2r-voltage', unaryBits: null, metrics, meetsSpec: true, failing: [], linearity: { definition: 'endpoint', monteCarlo: null }, glitch: { perTransition: series }, reference: { irefA: series, rinOhm: series }, output: { routOhm: series } }], cautions: [] }
}

/** A study of the demo team with one revision (with results) and one bench row; the other team gets the same path. */
async function ioStudy(f: Fixtures): Promise<{ studyId: number, benchId: number }> {
  const team = await f.db('teams').where({ slug: 'harrow-lake' }).first('id')
  const owner = await f.db('users').where({ email: 'engineer@harrowlake.example' }).first('id')
  const [studyId] = await f.db('studies').insert({ team_id: team.id, owner_id: owner.id, title: 'Matrix io study', spec: JSON.stringify(SPEC), version: 1 })
  await f.db('study_revisions').insert({ study_id: studyId, number: 1, spec: JSON.stringify(SPEC), process: JSON.stringify(PROCESS), options: JSON.stringify({ ...OPTIONS, inlDefinition: 'endpoint', envelopePoints: 256, confidence: 0.95 }), engine_version: 'matrix', results: JSON.stringify(fixtureResults()), author_id: owner.id })
  const [benchId] = await f.db('bench_measurements').insert({ team_id: team.id, study_id: studyId, candidate_id: 'r2r-voltage', revision_number: 1, uploaded_by: owner.id, file_name: 'matrix.csv', quantity: 'voltage', bits: 4, points: JSON.stringify(Array.from({ length: 16 }, (_, k) => k / 16)), summary: JSON.stringify({}) })
  return { studyId: studyId!, benchId: benchId! }
}

const READ = { signedOut: 401, admin: 200, architect: 200, engineer: 200, manager: 200, otherTeam: 404 }
const EDITORS = { signedOut: 401, admin: 201, architect: 201, engineer: 201, manager: 403, otherTeam: 201 }
const study = async (f: Fixtures, path: string) => ({ path: `/api/studies/${(await ioStudy(f)).studyId}${path}` })

export const IO_ROWS: MatrixRow[] = [
  { route: 'POST /api/studies/import/preview', expect: { ...EDITORS, admin: 200, architect: 200, engineer: 200, otherTeam: 200 }, request: () => ({ body: { text: CSV } }) },
  { route: 'POST /api/studies/import', expect: EDITORS, request: () => ({ body: { text: CSV, fileName: 'matrix.csv' } }) },
  { route: 'GET /api/studies/:id/export', expect: READ, request: f => study(f, '/export') },
  { route: 'GET /api/studies/:id/comparison', expect: READ, request: f => study(f, '/comparison') },
  { route: 'GET /api/studies/:id/netlist', expect: READ, request: f => study(f, '/netlist?candidate=r2r-voltage') },
  { route: 'GET /api/studies/:id/bench', expect: READ, request: f => study(f, '/bench') },
  {
    route: 'POST /api/studies/:id/bench',
    expect: { signedOut: 401, admin: 201, architect: 201, engineer: 201, manager: 403, otherTeam: 404 },
    request: async f => ({ ...(await study(f, '/bench')), body: { candidateId: 'r2r-voltage', fileName: 'matrix.csv', text: BENCH } })
  },
  {
    route: 'GET /api/studies/:id/bench/:benchId',
    expect: READ,
    request: async (f: Fixtures, _who: Who) => {
      const { studyId, benchId } = await ioStudy(f)
      return { path: `/api/studies/${studyId}/bench/${benchId}` }
    }
  }
]
