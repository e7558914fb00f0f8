/** Personal API tokens: what a token may do besides what its owner's role allows. */
export const TOKEN_SCOPES = ['read', 'write', 'evaluate'] as const
export type TokenScope = typeof TOKEN_SCOPES[number]

/** Every token starts with this, so a leaked one is recognisable (and a display token is not one). */
export const TOKEN_PREFIX = 'rwt_'

export type TokenStatus = 'active' | 'expired' | 'revoked'

/** A token as the list shows it: never the token itself, only its first characters. */
export interface ApiTokenDto {
  id: number
  name: string
  /** the token's first characters, e.g. `rwt_Ab3dE9xQ` */
  prefix: string
  scopes: TokenScope[]
  status: TokenStatus
  createdAt: string
  expiresAt: string
  revokedAt: string | null
  /** newest use, and requests counted over the last 30 days */
  lastUsedAt: string | null
  lastUsedIp: string | null
  requests30d: number
}

/** The answer to a creation: the only time the token is ever sent. */
export interface ApiTokenCreatedDto extends ApiTokenDto {
  token: string
}
