/**
 * Migrations and demo seeds: `tsx scripts/migrate.ts latest|rollback|rollback-all|seed`.
 * `rollback` undoes the last batch only; `rollback-all` undoes every migration.
 * The connection comes from NUXT_DATABASE_URL (default: the private instance of scripts/db.sh).
 */
import knex from 'knex'
import { knexConfig } from '../server/db/knexfile'

const command = process.argv[2] ?? 'latest'
const db = knex(knexConfig())

async function main(): Promise<void> {
  if (command === 'latest') {
    const [batch, names] = await db.migrate.latest()
    console.log(names.length ? `Migrated (batch ${batch}): ${names.join(', ')}` : 'Database schema is up to date')
  } else if (command === 'rollback' || command === 'rollback-all') {
    const [batch, names] = await db.migrate.rollback(undefined, command === 'rollback-all')
    console.log(`Rolled back batch ${batch}: ${names.join(', ') || 'nothing'}`)
  } else if (command === 'seed') {
    const [names] = await db.seed.run()
    console.log(`Seeded: ${names.map(n => n.split('/').pop()).join(', ')}`)
  } else {
    throw new Error(`Unknown command "${command}"; use latest, rollback, rollback-all or seed`)
  }
}

main()
  .catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error)
    process.exitCode = 1
  })
  .finally(() => db.destroy())
