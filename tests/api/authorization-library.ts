import type { Fixtures, MatrixRow, Who } from './authorization-table'

/** Matrix rows for process presets, spec templates and study revisions. */
const SPEC = { bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }
const PROCESS = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }
const PRESET_COLUMNS = { sheet_ohm_per_sq: 1000, matching_pct_um: 1, matching_convention: 'pair', unit_ohm: null, switch_ohm: 0, switch_skew_s: 0, switch_charge_c: 0, switch_area_um2: 0, gate_area_um2: 0, layout_overhead: 1.5, min_width_um: 0.4, min_length_um: 1 }

const unique = (who: Who) => `Matrix ${who} ${Date.now()} ${Math.floor(Math.random() * 1e6)}`

async function demoTeamId(f: Fixtures): Promise<number> {
  return (await f.db('teams').where({ slug: 'harrow-lake' }).first('id')).id
}

/** A fresh preset or template row of the demo team at version 1. */
async function ownRow(f: Fixtures, who: Who, kind: 'preset' | 'template'): Promise<number> {
  const row = { team_id: await demoTeamId(f), name: unique(who), ...(kind === 'preset' ? PRESET_COLUMNS : { spec: JSON.stringify(SPEC) }) }
  const [id] = await f.db(kind === 'preset' ? 'process_presets' : 'spec_templates').insert(row)
  return id!
}

/** A valid revision body on the study's current version. */
async function revisionBody(f: Fixtures) {
  const study = await f.db('studies').where({ id: f.ownStudyId }).first('version')
  return { baseVersion: study.version, spec: SPEC, process: PROCESS, options: { topologies: ['string'], trials: 0, seed: 1 } }
}

const READ_LIST = { signedOut: 401, admin: 200, architect: 200, engineer: 200, manager: 200, otherTeam: 200 }
const READ_OWN = { signedOut: 401, admin: 200, architect: 200, engineer: 200, manager: 200, otherTeam: 404 }
const CREATE = { signedOut: 401, admin: 201, architect: 201, engineer: 403, manager: 403, otherTeam: 201 }
const EDIT = { signedOut: 401, admin: 200, architect: 200, engineer: 403, manager: 403, otherTeam: 404 }
const REMOVE = { signedOut: 401, admin: 204, architect: 204, engineer: 403, manager: 403, otherTeam: 404 }

function libraryRows(kind: 'preset' | 'template'): MatrixRow[] {
  const base = kind === 'preset' ? '/api/presets' : '/api/templates'
  const content = kind === 'preset' ? { process: PROCESS } : { spec: SPEC }
  return [
    { route: `GET ${base}`, expect: READ_LIST, request: () => ({}) },
    { route: `POST ${base}`, expect: CREATE, request: (_f, who) => ({ body: { name: unique(who), ...content } }) },
    { route: `PATCH ${base}/:id`, expect: EDIT, request: async (f, who) => ({ path: `${base}/${await ownRow(f, who, kind)}`, body: { version: 1, name: unique(who) } }) },
    { route: `DELETE ${base}/:id`, expect: REMOVE, request: async (f, who) => ({ path: `${base}/${await ownRow(f, who, kind)}` }) }
  ]
}

export const LIBRARY_ROWS: MatrixRow[] = [
  ...libraryRows('preset'),
  ...libraryRows('template'),
  { route: 'GET /api/studies/:id/revisions', expect: READ_OWN, request: f => ({ path: `/api/studies/${f.ownStudyId}/revisions` }) },
  {
    route: 'POST /api/studies/:id/revisions',
    // the study belongs to the demo architect: engineers edit only their own studies (issue 6, roles)
    expect: { signedOut: 401, admin: 201, architect: 201, engineer: 403, manager: 403, otherTeam: 404, otherEngineer: 404 },
    request: async f => ({ path: `/api/studies/${f.ownStudyId}/revisions`, body: await revisionBody(f) })
  },
  { route: 'GET /api/studies/:id/revisions/:n', expect: READ_OWN, request: f => ({ path: `/api/studies/${f.ownStudyId}/revisions/1` }) },
  { route: 'GET /api/studies/:id/revisions/compare', expect: READ_OWN, request: f => ({ path: `/api/studies/${f.ownStudyId}/revisions/compare?from=1&to=1` }) }
]
