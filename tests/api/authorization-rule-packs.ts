import type { Fixtures, MatrixRow, Who } from './authorization-table'

/** A valid one-rule team pack with a fresh id per caller (ids are unique per team). */
export function matrixPack(tag: string) {
  return {
    id: `matrix-${tag.toLowerCase()}-${Date.now()}-${Math.floor(Math.random() * 1e6)}`,
    name: 'Matrix pack',
    rules: [{
      id: 'area-any', severity: 'note', title: 'Area noted', explanation: 'Area {metrics.totalAreaMm2|mm2}', action: 'None',
      basis: { handbook: ['§4.6'], metrics: ['totalAreaMm2'] }, threshold: { source: 'common-practice', note: 'matrix test' },
      conditions: { all: [{ fact: 'metrics', path: '$.totalAreaMm2', operator: 'greaterThan', value: 0 }] }
    }]
  }
}

/** A rule pack row of the demo team at version 1. */
async function ownPack(f: Fixtures, who: Who): Promise<number> {
  const admin = await f.db('users').where({ email: 'admin@harrowlake.example' }).first('id', 'team_id')
  const pack = matrixPack(who)
  const [id] = await f.db('rule_packs').insert({ team_id: admin.team_id, pack_id: pack.id, name: pack.name, pack: JSON.stringify(pack), enabled: false, version: 1 })
  return id!
}

const WRITE = { signedOut: 401, admin: 200, architect: 403, engineer: 403, manager: 403, otherTeam: 404 }
const READ_ONE = { signedOut: 401, admin: 200, architect: 200, engineer: 200, manager: 200, otherTeam: 404 }

export const RULE_PACK_ROWS: MatrixRow[] = [
  { route: 'GET /api/rule-packs', expect: { signedOut: 401, admin: 200, architect: 200, engineer: 200, manager: 200, otherTeam: 200 }, request: () => ({}) },
  {
    route: 'POST /api/rule-packs',
    expect: { signedOut: 401, admin: 201, architect: 403, engineer: 403, manager: 403, otherTeam: 201 },
    request: (_f, who) => ({ body: { pack: matrixPack(who) } })
  },
  { route: 'GET /api/rule-packs/:id', expect: READ_ONE, request: async (f, who) => ({ path: `/api/rule-packs/${await ownPack(f, who)}` }) },
  { route: 'GET /api/rule-packs/:id/history', expect: READ_ONE, request: async (f, who) => ({ path: `/api/rule-packs/${await ownPack(f, who)}/history` }) },
  {
    route: 'PATCH /api/rule-packs/:id',
    expect: WRITE,
    request: async (f, who) => ({ path: `/api/rule-packs/${await ownPack(f, who)}`, body: { version: 1, enabled: true } })
  },
  { route: 'POST /api/rule-packs/:id/dry-run', expect: WRITE, request: async (f, who) => ({ path: `/api/rule-packs/${await ownPack(f, who)}/dry-run`, body: {} }) },
  {
    route: 'POST /api/rule-packs/dry-run',
    expect: { signedOut: 401, admin: 200, architect: 403, engineer: 403, manager: 403, otherTeam: 200 },
    request: (_f, who) => ({ body: { pack: matrixPack(who) } })
  }
]
