import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // A team's own rule packs, run after the built-in pack on every evaluation while enabled.
  // `version` counts saves (optimistic concurrency) and is the version findings record.
  await knex.schema.createTable('rule_packs', (t) => {
    t.increments('id').primary()
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE')
    t.string('pack_id', 64).notNullable()
    t.string('name', 120).notNullable()
    t.json('pack').notNullable()
    t.boolean('enabled').notNullable().defaultTo(false)
    t.integer('version').unsigned().notNullable().defaultTo(1)
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL')
    t.integer('updated_by').unsigned().nullable().references('users.id').onDelete('SET NULL')
    t.timestamps(true, true)
    t.unique(['team_id', 'pack_id'])
  })
  // Every saved version of a pack, for its history and to re-read the rules a study ran with.
  await knex.schema.createTable('rule_pack_versions', (t) => {
    t.increments('id').primary()
    t.integer('rule_pack_id').unsigned().notNullable().references('rule_packs.id').onDelete('CASCADE')
    t.integer('version').unsigned().notNullable()
    t.json('pack').notNullable()
    t.boolean('enabled').notNullable()
    t.integer('author_id').unsigned().nullable().references('users.id').onDelete('SET NULL')
    t.string('change', 200).notNullable()
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.unique(['rule_pack_id', 'version'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('rule_pack_versions')
  await knex.schema.dropTable('rule_packs')
}
