import knex, { type Knex } from 'knex'
import { inject } from 'vitest'
import { knexConfig } from '../../server/db/knexfile'

/** A Knex handle on the throwaway test database (for arranging rows and checking writes). */
export function testDb(): Knex {
  return knex(knexConfig(inject('databaseUrl')))
}
