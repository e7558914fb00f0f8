import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // The one recommendation of a revision's results, ranked with the revision's weights when it was
  // written (null for inputs-only revisions and for revisions saved before it was kept).
  await knex.schema.alterTable('study_revisions', (t) => {
    t.json('recommendation').nullable()
  })
  // A decision on a candidate that fails spec lines carries one waiver per failing line (who, why).
  await knex.schema.alterTable('study_decisions', (t) => {
    t.json('waivers').nullable()
  })
  // The portfolio names the chosen (else recommended) candidate in words, not by its id.
  await knex.schema.alterTable('studies', (t) => {
    t.string('summary_label', 80).nullable()
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('studies', (t) => {
    t.dropColumn('summary_label')
  })
  await knex.schema.alterTable('study_decisions', (t) => {
    t.dropColumn('waivers')
  })
  await knex.schema.alterTable('study_revisions', (t) => {
    t.dropColumn('recommendation')
  })
}
