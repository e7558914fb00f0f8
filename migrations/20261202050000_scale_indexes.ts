import type { Knex } from 'knex'

// Indexes for a team with thousands of studies (the scale bench shows the plans with EXPLAIN):
// the portfolio filtered by status and sorted by last activity, and the two summary sorts; and
// the outbox's "sending but claim expired" branch, so claiming never scans sent mail.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('studies', (t) => {
    t.index(['team_id', 'status', 'updated_at'], 'studies_team_status_updated_index')
    t.index(['team_id', 'summary_area_mm2'], 'studies_team_area_index')
    t.index(['team_id', 'summary_fail_count'], 'studies_team_fails_index')
  })
  await knex.schema.alterTable('mail_outbox', (t) => {
    t.index(['status', 'claimed_at'], 'mail_outbox_status_claimed_index')
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('mail_outbox', (t) => {
    t.dropIndex(['status', 'claimed_at'], 'mail_outbox_status_claimed_index')
  })
  await knex.schema.alterTable('studies', (t) => {
    t.dropIndex(['team_id', 'summary_fail_count'], 'studies_team_fails_index')
    t.dropIndex(['team_id', 'summary_area_mm2'], 'studies_team_area_index')
    t.dropIndex(['team_id', 'status', 'updated_at'], 'studies_team_status_updated_index')
  })
}
