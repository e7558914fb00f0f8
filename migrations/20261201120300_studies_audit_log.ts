import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('studies', (t) => {
    t.increments('id').primary()
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE')
    t.integer('owner_id').unsigned().notNullable().references('users.id').onDelete('RESTRICT')
    t.string('title', 200).notNullable()
    t.string('block_name', 120).nullable()
    t.enum('status', ['draft', 'in_review', 'decided', 'archived']).notNullable().defaultTo('draft')
    t.json('spec').notNullable()
    t.integer('version').unsigned().notNullable().defaultTo(1)
    t.timestamps(true, true)
    t.index(['team_id', 'updated_at'])
    t.index(['team_id', 'status'])
  })
  await knex.schema.createTable('audit_log', (t) => {
    t.bigIncrements('id').primary()
    t.integer('team_id').unsigned().nullable().references('teams.id').onDelete('SET NULL')
    t.integer('actor_id').unsigned().nullable().references('users.id').onDelete('SET NULL')
    t.string('action', 60).notNullable()
    t.string('target_type', 40).notNullable()
    t.string('target_id', 64).nullable()
    t.json('detail').nullable()
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.index(['team_id', 'created_at'])
    t.index(['target_type', 'target_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_log')
  await knex.schema.dropTable('studies')
}
