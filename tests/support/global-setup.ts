import { execFileSync } from 'node:child_process'
import { fileURLToPath } from 'node:url'
import type { TestProject } from 'vitest/node'
import { startAppServer, stopAppServer } from './app-server'
import { destroyTestDatabase, startTestDatabase } from './mariadb'

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string
    databaseUrl: string
    databaseCnf: string
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
  const server = await startAppServer(database.url)
  project.provide('baseUrl', server.url)
  project.provide('databaseUrl', database.url)
  project.provide('databaseCnf', database.cnf)
  return async () => {
    await stopAppServer(server)
    await destroyTestDatabase(database)
  }
}
