import type { Knex } from 'knex'

/**
 * One cap for everything heavy a user runs (issue 13): evaluation jobs take a row in
 * `heavy_requests` too (`evaluation_id`), and every row counts only while its holder refreshes
 * `heartbeat_at`, so a slot whose instance died or lost the database frees itself after one stale
 * period, the same for jobs and requests.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('heavy_requests', (t) => {
    t.timestamp('heartbeat_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.integer('evaluation_id').unsigned().nullable().references('evaluations.id').onDelete('CASCADE')
    t.index(['user_id', 'heartbeat_at'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('heavy_requests', (t) => {
    t.dropForeign(['evaluation_id'])
    t.dropIndex(['user_id', 'heartbeat_at'])
    t.dropColumn('evaluation_id')
    t.dropColumn('heartbeat_at')
  })
}
