import type { Knex } from 'knex'

/**
 * Open note threads: first notes neither resolved nor deleted — what the portfolio and the brief
 * count. No auto-imports, so scripts (the scale bench) can load the portfolio query with tsx.
 */
export function openNoteThreads(db: Knex | Knex.Transaction, alias = 'notes') {
  return db(`notes as ${alias}`).whereNull(`${alias}.parent_id`).whereNull(`${alias}.resolved_at`).whereNull(`${alias}.deleted_at`)
}
