import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // Every save of a study is an immutable revision; studies.version is the head revision's number
  // (0 until the first revision is saved).
  await knex.schema.createTable('study_revisions', (t) => {
    t.increments('id').primary()
    t.integer('study_id').unsigned().notNullable().references('studies.id').onDelete('CASCADE')
    t.integer('number').unsigned().notNullable()
    t.json('spec').notNullable()
    t.json('process').notNullable()
    t.json('options').notNullable()
    t.string('engine_version', 40).notNullable()
    // The evaluate output the revision was saved with (large: per-code series); JSON is LONGTEXT in MariaDB.
    t.json('results').nullable()
    t.integer('evaluation_id').unsigned().nullable()
    t.string('note', 500).nullable()
    t.integer('author_id').unsigned().notNullable().references('users.id').onDelete('RESTRICT')
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.unique(['study_id', 'number'])
  })
  await knex.schema.alterTable('studies', (t) => {
    t.integer('version').unsigned().notNullable().defaultTo(0).alter()
  })
  // Existing studies have no revision yet.
  await knex('studies').update({ version: 0 })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('study_revisions')
  await knex('studies').where('version', 0).update({ version: 1 })
  await knex.schema.alterTable('studies', (t) => {
    t.integer('version').unsigned().notNullable().defaultTo(1).alter()
  })
}
