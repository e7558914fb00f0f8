/**
 * A throwaway stack for benchmarks: MariaDB on a free loopback port (tests/support/mariadb.ts),
 * migrated and demo-seeded by the real script, plus the built server. Needs `npx nuxi build`.
 */
import { execFileSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import { startAppServer, stopAppServer, SERVER_ENTRY, type AppServer } from '../../tests/support/app-server'
import { destroyTestDatabase, startTestDatabase, type TestDatabase } from '../../tests/support/mariadb'

export interface BenchStack { db: TestDatabase, server: AppServer | null, stop: () => Promise<void> }

/** Starts the database (migrated, demo-seeded); `startServer` then starts the app on it. */
export async function startBenchDatabase(): Promise<BenchStack> {
  if (!existsSync(SERVER_ENTRY)) throw new Error('No build found: run `npx nuxi build` first')
  const db = await startTestDatabase()
  const stack: BenchStack = {
    db,
    server: null,
    stop: async () => {
      if (stack.server) await stopAppServer(stack.server)
      await destroyTestDatabase(db)
    }
  }
  try {
    for (const command of ['latest', 'seed']) {
      execFileSync(process.execPath, ['--import', 'tsx', 'scripts/migrate.ts', command], { env: { ...process.env, NUXT_DATABASE_URL: db.url }, stdio: 'pipe' })
    }
  } catch (error) {
    await stack.stop()
    throw error
  }
  return stack
}

/**
 * Starts the built server on the stack's database. The app reaches the database through its Unix
 * socket (mysql2's socketPath), as a server on the same machine would; BENCH_DB_TCP=1 keeps TCP.
 */
export async function startServer(stack: BenchStack, env: Record<string, string> = {}): Promise<AppServer> {
  const url = process.env.BENCH_DB_TCP === '1' ? stack.db.url : `${stack.db.url}?socketPath=${encodeURIComponent(`${stack.db.dir}/db.sock`)}`
  stack.server = await startAppServer(url, env)
  return stack.server
}

/** Signs in once and returns the session cookie ("rw_session=…"). */
export async function benchSignIn(url: string, email: string, password: string): Promise<string> {
  const res = await fetch(`${url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) })
  const cookie = res.headers.getSetCookie().find(c => c.startsWith('rw_session='))
  if (res.status !== 200 || !cookie) throw new Error(`sign-in of ${email} answered ${res.status}`)
  return cookie.split(';')[0]!
}

/** The value at quantile q (0..1) of ascending-sorted numbers (nearest rank). */
export function quantile(sorted: readonly number[], q: number): number {
  if (!sorted.length) return Number.NaN
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))]!
}
