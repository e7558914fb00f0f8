import { execFileSync } from 'node:child_process'
import { rmSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import type { TestProject } from 'vitest/node'
import { startAppServer, stopAppServer } from './app-server'
import { newCatcherDir, startCatcherProcess, stopCatcher } from './mail-catcher'
import { destroyTestDatabase, freePort, startTestDatabase } from './mariadb'

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string
    databaseUrl: string
    /** The database a second app instance uses: another cluster node in `npm run test:cluster`, else databaseUrl. */
    databaseUrl2: string
    /** The throwaway instance's option file; empty when the tests run against an external database. */
    databaseCnf: string
    mailDir: string
    mailPort: number
  }
}

/**
 * An external database instead of a throwaway one, when RW_TEST_DATABASE_URL is set (the cluster
 * run points it at Galera node 1 and RW_TEST_DATABASE_URL_2 at node 2); it is migrated and seeded
 * like the throwaway one, and never stopped or deleted.
 */
async function useDatabase(): Promise<{ url: string, url2: string, cnf: string, destroy: () => Promise<void> }> {
  const external = process.env.RW_TEST_DATABASE_URL
  if (external) return { url: external, url2: process.env.RW_TEST_DATABASE_URL_2 || external, cnf: '', destroy: async () => undefined }
  const database = await startTestDatabase()
  return { url: database.url, url2: database.url, cnf: database.cnf, destroy: () => destroyTestDatabase(database) }
}

/** One throwaway MariaDB (migrated, demo-seeded) and one built app server for a test project. */
export default async function setup(project: TestProject) {
  const database = await useDatabase()
  // The real migrate/seed script, exactly as `npm start` runs it.
  const root = fileURLToPath(new URL('../..', import.meta.url))
  for (const command of ['latest', 'seed']) {
    execFileSync(process.execPath, ['--import', 'tsx', 'scripts/migrate.ts', command], { cwd: root, env: { ...process.env, NUXT_DATABASE_URL: database.url }, stdio: 'pipe' })
  }
  const mailPort = await freePort()
  const mailDir = newCatcherDir()
  await startCatcherProcess(mailPort, mailDir)
  const server = await startAppServer(database.url, {
    NUXT_SMTP_URL: `smtp://127.0.0.1:${mailPort}`, NUXT_MAIL_POLL_MS: '200', NUXT_MAIL_CATCHER_DIR: mailDir, NUXT_PUBLIC_MAIL_CATCHER: 'true'
  })
  project.provide('mailDir', mailDir)
  project.provide('mailPort', mailPort)
  project.provide('baseUrl', server.url)
  project.provide('databaseUrl', database.url)
  project.provide('databaseUrl2', database.url2)
  project.provide('databaseCnf', database.cnf)
  return async () => {
    await stopAppServer(server)
    // A test may have restarted the catcher: stop it through its pid file, not the first child.
    await stopCatcher(mailDir, mailPort)
    rmSync(mailDir, { recursive: true, force: true })
    await database.destroy()
  }
}
