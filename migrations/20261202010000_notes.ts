import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // Notes (the team's annotations) on a study, one candidate, or one metric of a candidate. A reply
  // names its thread's first note in parent_id. The revision and the metric's value when the note
  // was written are kept, so a later revision can say "number changed since".
  await knex.schema.createTable('notes', (t) => {
    t.increments('id').primary()
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE')
    t.integer('study_id').unsigned().notNullable().references('studies.id').onDelete('CASCADE')
    t.integer('parent_id').unsigned().nullable().references('notes.id').onDelete('CASCADE')
    t.enum('anchor_type', ['study', 'candidate', 'metric']).notNullable()
    t.string('candidate_id', 60).nullable()
    t.string('metric_key', 60).nullable()
    t.integer('revision').unsigned().notNullable()
    t.double('metric_value').nullable()
    t.text('body').notNullable()
    t.text('body_html', 'mediumtext').notNullable()
    t.integer('author_id').unsigned().notNullable().references('users.id').onDelete('RESTRICT')
    t.integer('version').unsigned().notNullable().defaultTo(1)
    t.timestamp('resolved_at', { precision: 3 }).nullable()
    t.integer('resolved_by').unsigned().nullable().references('users.id').onDelete('SET NULL')
    t.timestamp('deleted_at', { precision: 3 }).nullable()
    t.integer('deleted_by').unsigned().nullable().references('users.id').onDelete('SET NULL')
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.index(['study_id', 'parent_id'])
    t.index(['team_id', 'study_id', 'resolved_at', 'deleted_at'])
  })
  // Who a note mentions: one row per member, so an edit mails only the members it newly mentions.
  await knex.schema.createTable('note_mentions', (t) => {
    t.integer('note_id').unsigned().notNullable().references('notes.id').onDelete('CASCADE')
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE')
    t.primary(['note_id', 'user_id'])
  })
  // Files on notes, kept in the database beside their metadata (LONGBLOB: up to 4 GB, we allow 10 MB).
  await knex.schema.createTable('note_attachments', (t) => {
    t.increments('id').primary()
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE')
    t.integer('note_id').unsigned().notNullable().references('notes.id').onDelete('CASCADE')
    t.string('filename', 200).notNullable()
    t.string('mime_type', 60).notNullable()
    t.integer('size_bytes').unsigned().notNullable()
    t.string('sha256', 64).notNullable()
    t.specificType('data', 'LONGBLOB').notNullable()
    t.integer('uploaded_by').unsigned().notNullable().references('users.id').onDelete('RESTRICT')
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.index(['note_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('note_attachments')
  await knex.schema.dropTable('note_mentions')
  await knex.schema.dropTable('notes')
}
