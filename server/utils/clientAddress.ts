import type { H3Event } from 'h3'
import { isIP } from 'node:net'

/** The peer addresses listed in NUXT_TRUSTED_PROXIES (comma or space separated), normalised. */
function trustedProxies(): Set<string> {
  const raw = String(useRuntimeConfig().trustedProxies ?? '')
  return new Set(raw.split(/[\s,]+/).map(normaliseIp).filter(Boolean))
}

/** `::ffff:127.0.0.1` and `127.0.0.1` are one peer. */
function normaliseIp(ip: string): string {
  const trimmed = ip.trim()
  return trimmed.startsWith('::ffff:') && isIP(trimmed.slice(7)) === 4 ? trimmed.slice(7) : trimmed
}

/** True when the connection comes straight from a configured reverse proxy. */
export function fromTrustedProxy(event: H3Event): boolean {
  const peer = normaliseIp(event.node.req.socket?.remoteAddress ?? '')
  return peer !== '' && trustedProxies().has(peer)
}

/**
 * The client's address: the socket's peer, unless that peer is a configured proxy; then the
 * right-most X-Forwarded-For entry that is not itself a trusted proxy (entries further left are
 * whatever the client claimed). Anyone else's X-Forwarded-For is ignored.
 */
export function clientAddress(event: H3Event): string {
  const peer = normaliseIp(event.node.req.socket?.remoteAddress ?? '')
  if (!peer) return 'unknown'
  const trusted = trustedProxies()
  if (!trusted.has(peer)) return peer
  const forwarded = (getRequestHeader(event, 'x-forwarded-for') ?? '').split(',').map(normaliseIp).filter(ip => isIP(ip) !== 0)
  for (let i = forwarded.length - 1; i >= 0; i--) {
    if (!trusted.has(forwarded[i]!)) return forwarded[i]!
  }
  return forwarded[0] ?? peer
}
