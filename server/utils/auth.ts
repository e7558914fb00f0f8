import type { H3Event } from 'h3'
import { SignJWT, jwtVerify } from 'jose'
import { randomBytes } from 'node:crypto'
import type { Role, SessionUser } from '#shared/types/auth'

/** The httpOnly cookie that carries the session; the server trusts nothing else. */
export const SESSION_COOKIE = 'rw_session'

function secretKey(): Uint8Array {
  return new TextEncoder().encode(useRuntimeConfig().authSecret)
}

/** Creates a session row and sets the httpOnly cookie holding its signed token. */
export async function startSession(event: H3Event, userId: number): Promise<void> {
  const { sessionMaxAgeS, cookieSecure, https } = useRuntimeConfig()
  const tokenId = randomBytes(24).toString('hex')
  const expiresAt = new Date(Date.now() + sessionMaxAgeS * 1000)
  await useDb()('sessions').insert({ token_id: tokenId, user_id: userId, expires_at: expiresAt, ip: clientAddress(event) })
  const jwt = await new SignJWT({ sub: String(userId) }).setProtectedHeader({ alg: 'HS256' })
    .setJti(tokenId).setIssuedAt().setExpirationTime(Math.floor(expiresAt.getTime() / 1000)).sign(secretKey())
  setCookie(event, SESSION_COOKIE, jwt, { httpOnly: true, sameSite: 'lax', secure: Boolean(cookieSecure) || Boolean(https), path: '/', maxAge: sessionMaxAgeS })
}

/** Revokes the current session (if any) and clears the cookie. */
export async function endSession(event: H3Event): Promise<void> {
  const tokenId = await readTokenId(event)
  if (tokenId) await useDb()('sessions').where({ token_id: tokenId }).update({ revoked_at: new Date() })
  deleteCookie(event, SESSION_COOKIE, { path: '/' })
}

async function readTokenId(event: H3Event): Promise<string | null> {
  const jwt = getCookie(event, SESSION_COOKIE)
  if (!jwt) return null
  try {
    const { payload } = await jwtVerify(jwt, secretKey(), { algorithms: ['HS256'] })
    return typeof payload.jti === 'string' ? payload.jti : null
  } catch {
    return null
  }
}

/** The signed-in user, or null: verifies the token, then the session row and the user row. */
export async function getSessionUser(event: H3Event): Promise<SessionUser | null> {
  if (event.context.user !== undefined) return event.context.user as SessionUser | null
  const tokenId = await readTokenId(event)
  let user: SessionUser | null = null
  if (tokenId) {
    const row = await useDb()('sessions as s')
      .join('users as u', 'u.id', 's.user_id').join('teams as t', 't.id', 'u.team_id')
      .where('s.token_id', tokenId).whereNull('s.revoked_at').where('s.expires_at', '>', new Date()).where('u.active', true)
      .first('u.id', 'u.email', 'u.display_name', 'u.role', 'u.team_id', 't.name as team_name')
    if (row) user = { id: row.id, email: row.email, name: row.display_name, role: row.role, teamId: row.team_id, teamName: row.team_name }
  }
  event.context.user = user
  return user
}

/**
 * Every protected route calls this first: 401 when signed out, 403 when the role is not in `roles`
 * (no roles given = any signed-in user). Returns the user, whose teamId scopes every query.
 */
export async function requireUser(event: H3Event, ...roles: Role[]): Promise<SessionUser> {
  // An API token (Authorization: Bearer rwt_…) instead of the session cookie: server/utils/apiTokens.ts
  const apiToken = apiTokenOf(event)
  const user = apiToken ? await apiTokenUser(event, apiToken) : await getSessionUser(event)
  if (!user) throw createError({ statusCode: 401, statusMessage: MESSAGES.notSignedIn })
  if (roles.length > 0 && !roles.includes(user.role)) throw createError({ statusCode: 403, statusMessage: MESSAGES.forbidden })
  return user
}

/** An opaque value for the client-side auth state cookie; it grants nothing on the server. */
export function displayToken(): string {
  return randomBytes(16).toString('hex')
}
