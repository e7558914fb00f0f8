import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // A measured transfer uploaded for a study, compared with one of its candidates. The parsed
  // levels (one per code, JSON is LONGTEXT in MariaDB) and the INL/DNL summary computed from them.
  await knex.schema.createTable('bench_measurements', (t) => {
    t.increments('id').primary()
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE')
    t.integer('study_id').unsigned().notNullable().references('studies.id').onDelete('CASCADE')
    t.string('candidate_id', 60).notNullable()
    t.integer('revision_number').unsigned().notNullable()
    t.integer('uploaded_by').unsigned().notNullable().references('users.id').onDelete('RESTRICT')
    t.string('file_name', 255).notNullable()
    t.enum('quantity', ['voltage', 'current']).notNullable()
    t.integer('bits').unsigned().notNullable()
    t.json('points').notNullable()
    t.json('summary').notNullable()
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.index(['study_id', 'created_at'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('bench_measurements')
}
