import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // Synchronous heavy requests in flight (evaluate, netlist, dry runs), one row each while it runs,
  // so the per-user cap holds across app instances. A row an instance left behind when it died
  // stops counting after a while (server/utils/heavyRequests.ts).
  await knex.schema.createTable('heavy_requests', (t) => {
    t.bigIncrements('id').primary()
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE')
    t.string('kind', 20).notNullable()
    t.timestamp('started_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.index(['user_id', 'started_at'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('heavy_requests')
}
