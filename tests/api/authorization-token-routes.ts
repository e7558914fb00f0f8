import { createHash, randomBytes } from 'node:crypto'
import type { Fixtures, MatrixRow } from './authorization-table'

/** A fresh token row of the demo engineer (the token itself is never needed here). */
async function engineerToken(f: Fixtures): Promise<number> {
  const engineer = await f.db('users').where({ email: 'engineer@harrowlake.example' }).first('id', 'team_id')
  const token = `rwt_${randomBytes(32).toString('base64url')}`
  const [id] = await f.db('api_tokens').insert({
    user_id: engineer.id, team_id: engineer.team_id, name: 'Matrix token', prefix: token.slice(0, 12),
    token_hash: createHash('sha256').update(token).digest('hex'), scopes: 'read', expires_at: new Date(Date.now() + 86_400_000)
  })
  return id!
}

const EVERY_ROLE = { admin: 200, architect: 200, engineer: 200, manager: 200, otherTeam: 200 }

/** The token routes: every signed-in user manages their own tokens only (404 for anyone else's, admins included). */
export const TOKEN_ROWS: MatrixRow[] = [
  { route: 'GET /api/tokens', expect: { signedOut: 401, ...EVERY_ROLE }, request: () => ({}) },
  {
    route: 'POST /api/tokens',
    expect: { signedOut: 401, admin: 201, architect: 201, engineer: 201, manager: 201, otherTeam: 201 },
    request: (_f, who) => ({ body: { name: `Matrix ${who}`, scopes: ['read'], expiresInDays: 1 } })
  },
  {
    route: 'DELETE /api/tokens/:id',
    expect: { signedOut: 401, admin: 404, architect: 404, engineer: 200, manager: 404, otherTeam: 404 },
    request: async f => ({ path: `/api/tokens/${await engineerToken(f)}` })
  }
]
