import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // status_version counts status changes (review requests, sign-offs, decisions, reopen, archive):
  // a status change names the one it saw and gets 409 when someone moved the study first.
  // decision_candidate_id is the chosen option of the decision in force (the portfolio lists it).
  await knex.schema.alterTable('studies', (t) => {
    t.integer('status_version').unsigned().notNullable().defaultTo(0)
    t.string('decision_candidate_id', 60).nullable()
  })
  // One row per reviewer named in a review request (kind 'assigned') and per verdict
  // ('signed_off' or 'changes_requested', on the revision that was current then).
  await knex.schema.createTable('study_reviews', (t) => {
    t.increments('id').primary()
    t.integer('study_id').unsigned().notNullable().references('studies.id').onDelete('CASCADE')
    t.integer('round').unsigned().notNullable()
    t.enum('kind', ['assigned', 'signed_off', 'changes_requested']).notNullable()
    t.integer('reviewer_id').unsigned().notNullable().references('users.id').onDelete('RESTRICT')
    t.integer('revision_number').unsigned().notNullable()
    t.text('comment').nullable()
    t.integer('created_by').unsigned().notNullable().references('users.id').onDelete('RESTRICT')
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.index(['study_id', 'round'])
  })
  // Every decision ever taken; a reopen marks the one in force superseded and keeps it.
  await knex.schema.createTable('study_decisions', (t) => {
    t.increments('id').primary()
    t.integer('study_id').unsigned().notNullable().references('studies.id').onDelete('CASCADE')
    t.string('candidate_id', 60).notNullable()
    t.text('rationale').notNullable()
    t.integer('revision_number').unsigned().notNullable()
    t.json('sign_off_ids').notNullable()
    t.integer('decided_by').unsigned().notNullable().references('users.id').onDelete('RESTRICT')
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.timestamp('superseded_at', { precision: 3 }).nullable()
    t.index(['study_id', 'created_at'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('study_decisions')
  await knex.schema.dropTable('study_reviews')
  await knex.schema.alterTable('studies', (t) => {
    t.dropColumns('status_version', 'decision_candidate_id')
  })
}
