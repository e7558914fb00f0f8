import type { Knex } from 'knex'
import type { ApiTokenDto, TokenScope } from '#shared/types/tokens'

/** A user's tokens (newest first, or one by id) with their newest use and 30-day request count. */
export function userApiTokens(db: Knex, userId: number) {
  const since = new Date(Date.now() - 30 * 86_400_000)
  const uses = db('api_token_uses').where('window_start', '>', since).groupBy('token_id')
    .select('token_id').sum({ requests: 'requests' }).max({ last_at: 'last_at' })
  return db('api_tokens as k').leftJoin(uses.as('w'), 'w.token_id', 'k.id').where('k.user_id', userId)
    .orderBy('k.created_at', 'desc').orderBy('k.id', 'desc')
    .select('k.id', 'k.name', 'k.prefix', 'k.scopes', 'k.created_at', 'k.expires_at', 'k.revoked_at', 'w.requests', 'w.last_at',
      db.raw('(SELECT u.last_ip FROM api_token_uses u WHERE u.token_id = k.id ORDER BY u.window_start DESC LIMIT 1) AS last_ip'))
}

interface TokenRow {
  id: number
  name: string
  prefix: string
  scopes: string
  created_at: Date
  expires_at: Date
  revoked_at: Date | null
  requests: number | string | null
  last_at: Date | null
  last_ip: string | null
}

export function toApiTokenDto(row: TokenRow): ApiTokenDto {
  const expired = new Date(row.expires_at).getTime() <= Date.now()
  return {
    id: row.id,
    name: row.name,
    prefix: row.prefix,
    scopes: row.scopes.split(',') as TokenScope[],
    status: row.revoked_at ? 'revoked' : expired ? 'expired' : 'active',
    createdAt: new Date(row.created_at).toISOString(),
    expiresAt: new Date(row.expires_at).toISOString(),
    revokedAt: row.revoked_at ? new Date(row.revoked_at).toISOString() : null,
    lastUsedAt: row.last_at ? new Date(row.last_at).toISOString() : null,
    lastUsedIp: row.last_ip,
    requests30d: Number(row.requests ?? 0)
  }
}
