import type { H3Event } from 'h3'
import { createHash, randomBytes } from 'node:crypto'
import type { SessionUser } from '#shared/types/auth'
import { TOKEN_PREFIX, TOKEN_SCOPES, type TokenScope } from '#shared/types/tokens'

/**
 * Personal API tokens (`Authorization: Bearer rwt_…`): the check requireUser calls when a request
 * carries one. A token is 32 random bytes; only its SHA-256 is stored. The user row is read on
 * every request (a deactivated member's token fails at once, a role change applies at once), the
 * token's scopes narrow what the role allows, and each token has a per-minute request limit counted
 * in `api_token_uses` (one upsert per request, shared by every app instance).
 */

const TOKEN_SHAPE = /^rwt_[\w-]{43}$/
/** Requests that start or cancel computations: the evaluate scope. */
const EVALUATE_ROUTES = [/^\/api\/(evaluate|solve|netlist|evaluations)$/, /^\/api\/evaluations\/[^/]+$/, /^\/api\/rule-packs\/([^/]+\/)?dry-run$/]

export function hashApiToken(token: string): string {
  return createHash('sha256').update(token).digest('hex')
}

/** A new token, its recognisable prefix (the first 12 characters) and its hash. */
export function newApiToken(): { token: string, prefix: string, hash: string } {
  const token = `${TOKEN_PREFIX}${randomBytes(32).toString('base64url')}`
  return { token, prefix: token.slice(0, 12), hash: hashApiToken(token) }
}

/**
 * The API token a request carries, or null. Only `rwt_` bearer values are tokens: the sign-in
 * module sends its display token as a bearer value too, and that one still grants nothing.
 */
export function apiTokenOf(event: H3Event): string | null {
  const header = getRequestHeader(event, 'authorization')
  const match = header ? /^Bearer\s+(rwt_\S*)\s*$/i.exec(header) : null
  return match ? match[1]! : null
}

/** The scope a request needs: read for reads, evaluate for computations, write otherwise; null: never with a token. */
export function tokenScopeFor(method: string, rawPath: string): TokenScope | null {
  let path = rawPath.split('?')[0]!
  try {
    path = decodeURIComponent(path)
  } catch {
    // keep it as sent: the router will not match it either
  }
  path = path.replace(/\/{2,}/g, '/').replace(/\/$/, '').toLowerCase()
  if (path === '/api/tokens' || path.startsWith('/api/tokens/')) return null
  if (method === 'GET' || method === 'HEAD') return 'read'
  if ((method === 'POST' || method === 'DELETE') && EVALUATE_ROUTES.some(r => r.test(path))) return 'evaluate'
  return 'write'
}

function refused(statusCode: number, message: string) {
  return createError({ statusCode, statusMessage: statusCode === 401 ? MESSAGES.notSignedIn : statusCode === 429 ? 'Too many requests' : MESSAGES.forbidden, message, data: { message } })
}

/** The minute a request counts in (the app's clock; instances are expected to keep time). */
function windowOf(now: number): Date {
  return new Date(Math.floor(now / 60_000) * 60_000)
}

/** Counts one use in the current minute and returns the count including it (LAST_INSERT_ID carries it back). */
async function countUse(tokenId: number, window: Date, ip: string | null): Promise<number> {
  const [result] = await retryOnDeadlock(() => useDb().raw(
    'INSERT INTO api_token_uses (token_id, window_start, requests, last_ip) VALUES (?, ?, 1, ?) '
    + 'ON DUPLICATE KEY UPDATE requests = LAST_INSERT_ID(requests + 1), last_at = CURRENT_TIMESTAMP(3), last_ip = VALUES(last_ip)',
    [tokenId, window, ip]
  ))
  const counted = Number((result as { insertId?: number }).insertId ?? 0)
  return counted === 0 ? 1 : counted
}

/**
 * The user a token acts for, after its checks: 401 for a token that is malformed, unknown,
 * expired, revoked or whose member is deactivated; 429 past the per-minute limit (the first
 * refusal of a minute is audited); 403 when its scopes do not cover the request, or on the token
 * routes (tokens never manage tokens). The role check stays with requireUser.
 */
export async function apiTokenUser(event: H3Event, token: string): Promise<SessionUser> {
  if (!TOKEN_SHAPE.test(token)) throw refused(401, 'This API token is not valid')
  const now = Date.now()
  const row = await useDb()('api_tokens as k').join('users as u', 'u.id', 'k.user_id').join('teams as t', 't.id', 'u.team_id')
    .where('k.token_hash', hashApiToken(token)).whereNull('k.revoked_at').where('k.expires_at', '>', new Date(now)).where('u.active', true)
    .first('k.id as token_id', 'k.scopes', 'k.prefix', 'u.id', 'u.email', 'u.display_name', 'u.role', 'u.team_id', 't.name as team_name')
  if (!row) throw refused(401, 'This API token is not valid: unknown, expired, revoked, or its member can no longer sign in')
  const user: SessionUser = { id: row.id, email: row.email, name: row.display_name, role: row.role, teamId: row.team_id, teamName: row.team_name }
  const window = windowOf(now)
  const used = await countUse(row.token_id, window, getRequestIP(event, { xForwardedFor: false }) ?? null)
  const limit = Number(useRuntimeConfig().apiTokenRequestsPerMinute)
  if (used > limit) {
    if (used === limit + 1) {
      await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'api_token_rate_limited', targetType: 'api_token', targetId: row.token_id, detail: { prefix: row.prefix, limit } })
    }
    setResponseHeader(event, 'retry-after', Math.ceil((window.getTime() + 60_000 - now) / 1000))
    throw refused(429, `This API token made more than ${limit} requests this minute; wait for the next minute`)
  }
  const scopes = String(row.scopes).split(',') as TokenScope[]
  const needs = tokenScopeFor(event.method, event.path)
  if (needs === null) throw refused(403, 'API tokens cannot manage API tokens; sign in to the app to do that')
  if (!scopes.includes(needs)) throw refused(403, `This API token has the scopes ${scopes.join(', ')}; this request needs ${needs}`)
  event.context.user = user
  event.context.apiTokenId = row.token_id
  return user
}

/** For the token routes: a request authenticated by a token is refused, whatever its path looked like. */
export function refuseApiToken(event: H3Event): void {
  if (event.context.apiTokenId !== undefined) throw refused(403, 'API tokens cannot manage API tokens; sign in to the app to do that')
}

export function scopesText(scopes: readonly TokenScope[]): string {
  return TOKEN_SCOPES.filter(s => scopes.includes(s)).join(',')
}
