import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // Sessions live in the database so sign-out revokes them and any app instance can verify them.
  await knex.schema.createTable('sessions', (t) => {
    t.increments('id').primary()
    t.string('token_id', 64).notNullable().unique()
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE')
    t.dateTime('expires_at').notNullable()
    t.dateTime('revoked_at').nullable()
    t.string('ip', 64).nullable()
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now())
    t.index(['user_id'])
  })
  // Failed sign-ins, keyed by account and by address, for rate limiting shared across instances.
  await knex.schema.createTable('sign_in_attempts', (t) => {
    t.increments('id').primary()
    t.string('scope_key', 300).notNullable()
    t.timestamp('attempted_at').notNullable().defaultTo(knex.fn.now())
    t.index(['scope_key', 'attempted_at'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sign_in_attempts')
  await knex.schema.dropTable('sessions')
}
