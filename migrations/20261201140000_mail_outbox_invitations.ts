import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // Outgoing mail is written in the same transaction as the action that causes it and sent later,
  // with retries, by whichever app instance claims it first.
  await knex.schema.createTable('mail_outbox', (t) => {
    t.increments('id').primary()
    t.integer('team_id').unsigned().nullable().references('teams.id').onDelete('SET NULL')
    t.string('template', 40).notNullable()
    t.string('to_address', 254).notNullable()
    t.string('subject', 300).notNullable()
    t.text('text_body', 'mediumtext').notNullable()
    t.text('html_body', 'mediumtext').notNullable()
    t.enum('status', ['pending', 'sending', 'sent', 'failed']).notNullable().defaultTo('pending')
    t.integer('attempts').unsigned().notNullable().defaultTo(0)
    t.timestamp('next_attempt_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.timestamp('claimed_at', { precision: 3 }).nullable()
    t.text('last_error').nullable()
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.timestamp('sent_at', { precision: 3 }).nullable()
    t.index(['status', 'next_attempt_at'])
  })
  await knex.schema.createTable('invitations', (t) => {
    t.increments('id').primary()
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE')
    t.string('email', 254).notNullable()
    t.string('display_name', 120).notNullable()
    t.enum('role', ['admin', 'architect', 'engineer', 'manager']).notNullable()
    t.string('token_hash', 64).notNullable().unique()
    t.dateTime('expires_at').notNullable()
    t.dateTime('accepted_at').nullable()
    t.integer('invited_by').unsigned().nullable().references('users.id').onDelete('SET NULL')
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now())
    t.index(['team_id', 'email'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invitations')
  await knex.schema.dropTable('mail_outbox')
}
