import type { MatrixRow, Who } from './authorization-table'

/**
 * Token callers of the authorization matrix: each demo role with a token of one scope, an admin
 * of another team with every scope, and the sign-in module's display token sent as a bearer value.
 * What each should get is written here as the rule the product promises (README, "API tokens"),
 * independently of the server's code: a token acts with its owner's role, narrowed by its scope.
 */
export type TokenScope = 'read' | 'write' | 'evaluate'
export type SessionWho = Exclude<Who, 'signedOut'>

export interface TokenCaller {
  name: string
  /** whose token it is (the session caller with the same user) */
  as: SessionWho
  scopes: TokenScope[]
}

const ROLES = ['admin', 'architect', 'engineer', 'manager'] as const
const SCOPES: TokenScope[] = ['read', 'write', 'evaluate']

export const TOKEN_CALLERS: TokenCaller[] = [
  ...ROLES.flatMap(role => SCOPES.map(scope => ({ name: `token-${role}-${scope}`, as: role, scopes: [scope] }))),
  { name: 'token-otherteam-all', as: 'otherTeam', scopes: SCOPES }
]

/** Routes that need no sign-in: a token changes nothing there. */
const PUBLIC = ['GET /api/health', 'POST /api/auth/login', 'POST /api/auth/logout', 'GET /api/invitations/:token', 'POST /api/invitations/:token/accept', 'GET /api/openapi.json']
/** Routes that start or cancel computations. */
const EVALUATE = ['POST /api/evaluate', 'POST /api/solve', 'POST /api/netlist', 'POST /api/evaluations', 'DELETE /api/evaluations/:id', 'POST /api/rule-packs/dry-run', 'POST /api/rule-packs/:id/dry-run']

/** 'public', 'none' (tokens never manage tokens), or the scope the route needs. */
export function routeScope(route: string): TokenScope | 'public' | 'none' {
  const [method, path] = route.split(' ') as [string, string]
  if (PUBLIC.includes(route)) return 'public'
  if (path === '/api/tokens' || path.startsWith('/api/tokens/')) return 'none'
  if (method === 'GET') return 'read'
  return EVALUATE.includes(route) ? 'evaluate' : 'write'
}

/** The status a token caller must get on a row: as its owner's session where the scope allows, else 403. */
export function tokenExpectation(row: MatrixRow, caller: TokenCaller | 'display'): number | undefined {
  // each failed sign-in counts against the address (auth.spec.ts checks the limits); a bearer value changes nothing there
  if (row.route === 'POST /api/auth/login') return undefined
  const scope = routeScope(row.route)
  if (caller === 'display') return row.expect.signedOut
  if (scope === 'public') return row.expect.signedOut
  if (scope === 'none' || !caller.scopes.includes(scope)) return 403
  return row.expect[caller.as]
}
