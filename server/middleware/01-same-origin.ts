/**
 * Refuses state-changing API requests sent from another site: the Origin (or Referer) must match
 * the host. Together with the SameSite session cookie this stops cross-site request forgery.
 */
export default defineEventHandler((event) => {
  if (!event.path.startsWith('/api/') || ['GET', 'HEAD', 'OPTIONS'].includes(event.method)) return
  const source = getRequestHeader(event, 'origin') ?? getRequestHeader(event, 'referer')
  if (!source) return // non-browser clients (CLI scripts, tests) send no Origin; the session cookie still decides
  // X-Forwarded-Host only from a configured proxy: anyone else could name any host in it.
  const forwardedHost = fromTrustedProxy(event) ? getRequestHeader(event, 'x-forwarded-host') : undefined
  const host = forwardedHost ?? getRequestHeader(event, 'host')
  let sourceHost: string | null = null
  try {
    sourceHost = new URL(source).host
  } catch {
    sourceHost = null
  }
  if (!host || sourceHost !== host) {
    throw createError({ statusCode: 403, statusMessage: 'Cross-site request refused' })
  }
})
