import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // Evaluation jobs: the state lives here (not in one process) so any app instance can report
  // progress, cancel, or hand the result to a revision.
  await knex.schema.createTable('evaluations', (t) => {
    t.increments('id').primary()
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE')
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE')
    t.enum('status', ['queued', 'running', 'done', 'failed', 'cancelled']).notNullable().defaultTo('queued')
    t.integer('tasks_total').unsigned().notNullable()
    t.integer('tasks_done').unsigned().notNullable().defaultTo(0)
    t.json('input').notNullable()
    t.json('result').nullable()
    t.string('engine_version', 40).notNullable()
    t.text('error').nullable()
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'))
    t.timestamp('heartbeat_at', { precision: 3 }).nullable()
    t.timestamp('finished_at', { precision: 3 }).nullable()
    t.index(['team_id', 'created_at'])
    t.index(['user_id', 'status'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('evaluations')
}
