import knex, { type Knex } from 'knex'
import { knexConfig } from '../db/knexfile'
import { retryOnDeadlock } from './retry'

let instance: Knex | undefined

/** The lazily created Knex singleton for this server process (pool settings in knexfile.ts). */
export function useDb(): Knex {
  if (!instance) {
    const { databaseUrl } = useRuntimeConfig()
    instance = knex(knexConfig(databaseUrl))
  }
  return instance
}

/**
 * `useDb().transaction(work)`, run again when the database rolls it back as a deadlock victim or
 * a Galera certification failure (see retry.ts). Use it for writes whose every effect is inside
 * the transaction; the work function must not keep state between tries.
 */
export function writeTransaction<T>(work: (trx: Knex.Transaction) => Promise<T>): Promise<T> {
  return retryOnDeadlock(() => useDb().transaction(work), {
    onRetry: (error, attempt) => console.warn(`[rungwise] transaction retried after ${(error as { code?: string }).code} (try ${attempt + 1})`)
  })
}

/** Codes that mean "the database cannot be reached", as opposed to a bad query. */
const UNAVAILABLE_CODES = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'PROTOCOL_CONNECTION_LOST',
  'ER_CON_COUNT_ERROR', 'ER_SERVER_SHUTDOWN', 'ER_ACCESS_DENIED_ERROR', 'ER_BAD_DB_ERROR'
])

/** True when an error says the database is down or unreachable (→ 503, not 500). */
export function isDatabaseUnavailable(error: unknown): boolean {
  if (!error || typeof error !== 'object') return false
  const { code, errno, name, message } = error as { code?: string, errno?: number, name?: string, message?: string }
  if (code && UNAVAILABLE_CODES.has(code)) return true
  if (name === 'KnexTimeoutError') return true
  // mysql2 marks connection-level failures fatal; a transaction whose connection died mid-way fails
  // its ROLLBACK with "Can't add new command when connection is in closed state" and no code.
  if ((error as { fatal?: unknown }).fatal === true) return true
  // A Galera node without quorum refuses queries ("WSREP has not yet prepared node for application
  // use", errno 1047) until the cluster heals: unavailable, not a bug.
  if (errno === 1047) return true
  return typeof message === 'string' && /connect ECONNREFUSED|Connection lost|Timeout acquiring a connection|WSREP has not yet prepared node|closed state/.test(message)
}
