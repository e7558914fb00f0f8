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
    databaseCnf: string
    mailDir: string
    mailPort: number
  }
}

/** One throwaway MariaDB (migrated, demo-seeded) and one built app server for a test project. */
export default async function setup(project: TestProject) {
  const database = await startTestDatabase()
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
  project.provide('databaseCnf', database.cnf)
  return async () => {
    await stopAppServer(server)
    // A test may have restarted the catcher: stop it through its pid file, not the first child.
    await stopCatcher(mailDir, mailPort)
    rmSync(mailDir, { recursive: true, force: true })
    await destroyTestDatabase(database)
  }
}
