import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // Personal API tokens: only the SHA-256 of the token is kept (it is shown once, on creation);
  // `prefix` is its first characters, to recognise it in the list. The user's role is read from
  // the users row on every request, so a token never grants more than its owner's role does now.
  await knex.schema.createTable('api_tokens', (t) => {
    t.increments('id').primary()
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE')
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE')
    t.string('name', 80).notNullable()
    t.string('prefix', 16).notNullable()
    t.string('token_hash', 64).notNullable().unique()
    t.string('scopes', 40).notNullable()
    t.dateTime('expires_at').notNullable()
    t.dateTime('revoked_at').nullable()
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now())
    t.index(['user_id', 'created_at'])
  })
  // Use of each token per minute: the rate limit counts `requests` of the current window across
  // app instances, and the rows stay as the per-use record (how often, when last, from where).
  await knex.schema.createTable('api_token_uses', (t) => {
    t.integer('token_id').unsigned().notNullable().references('api_tokens.id').onDelete('CASCADE')
    t.dateTime('window_start').notNullable()
    t.integer('requests').unsigned().notNullable().defaultTo(0)
    t.integer('refused').unsigned().notNullable().defaultTo(0)
    t.timestamp('last_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.string('last_ip', 64).nullable()
    t.primary(['token_id', 'window_start'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('api_token_uses')
  await knex.schema.dropTable('api_tokens')
}
