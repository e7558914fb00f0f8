import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('teams', (t) => {
    t.increments('id').primary()
    t.string('name', 120).notNullable()
    t.string('slug', 60).notNullable().unique()
    t.timestamps(true, true)
  })
  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary()
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('RESTRICT')
    t.string('email', 254).notNullable().unique()
    t.string('display_name', 120).notNullable()
    t.string('password_hash', 100).notNullable()
    t.enum('role', ['admin', 'architect', 'engineer', 'manager']).notNullable()
    t.boolean('active').notNullable().defaultTo(true)
    t.timestamps(true, true)
    t.index(['team_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('users')
  await knex.schema.dropTable('teams')
}
