import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // A finished job's output, gzip-compressed JSON (about a tenth of the text): a worker thread
  // compresses it, so the request thread and the database move ~200 kB instead of ~2 MB per job.
  // Rows written before keep their `result` text; readers take whichever is set.
  await knex.schema.alterTable('evaluations', (t) => {
    t.specificType('result_gz', 'LONGBLOB').nullable()
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('evaluations', (t) => {
    t.dropColumn('result_gz')
  })
}
