import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // What the portfolio lists, written when a revision with results is saved, so the list never
  // has to read the (large) results of every study.
  await knex.schema.alterTable('studies', (t) => {
    t.string('summary_candidate_id', 60).nullable()
    t.double('summary_area_mm2').nullable()
    t.integer('summary_fail_count').unsigned().nullable()
    t.integer('summary_meeting_count').unsigned().nullable()
    t.integer('summary_candidate_count').unsigned().nullable()
    t.index(['team_id', 'title'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('studies', (t) => {
    t.dropIndex(['team_id', 'title'])
    t.dropColumns('summary_candidate_id', 'summary_area_mm2', 'summary_fail_count', 'summary_meeting_count', 'summary_candidate_count')
  })
}
