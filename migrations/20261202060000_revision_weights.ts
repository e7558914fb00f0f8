import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // The ranking weights the study was judged with, saved with each immutable revision (null for
  // revisions saved before weights were kept: the defaults apply).
  await knex.schema.alterTable('study_revisions', (t) => {
    t.json('weights').nullable()
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('study_revisions', (t) => {
    t.dropColumn('weights')
  })
}
