/**
 * Evaluates the demo studies with the engine, so a fresh `npm start` shows computed trade studies
 * (comparison, findings, portfolio columns) instead of "not evaluated yet".
 * `tsx scripts/demo-results.ts`: for each demo study whose only revision is the seeded inputs-only
 * one, runs the full evaluation (the same engine and built-in rule packs as POST /api/evaluate and
 * the CLI) and saves it as revision 2 through writeRevision, like a user's save (the
 * recommendation ranked with the study's weights). Idempotent: a study that already
 * has a second revision is left alone. Not part of the test seeds (tests start from inputs only).
 */
import knex from 'knex'
import { evaluateInputSchema } from '../shared/core/contract/evaluate'
import { evaluateSpec } from '../shared/core/evaluate'
import { ENGINE_VERSION } from '../shared/core/version'
import { applyFindings } from '../shared/findings/index'
import { DEMO_TEAM } from '../migrations/seeds/01-demo-team'
import { STUDIES } from '../migrations/seeds/03-demo-studies'
import { knexConfig } from '../server/db/knexfile'
import { writeRevision } from '../server/db/writeRevision'

const db = knex(knexConfig())

function json<T>(value: unknown): T {
  return (typeof value === 'string' ? JSON.parse(value) : value) as T
}

async function main(): Promise<void> {
  const team = await db('teams').where({ slug: DEMO_TEAM.slug }).first('id')
  if (!team) throw new Error('The demo team is missing: run the seeds first (tsx scripts/migrate.ts seed)')
  const studies = await db('studies').where({ team_id: team.id, version: 1 }).whereIn('title', STUDIES.map(s => s.title)).select('id', 'title', 'owner_id')
  for (const study of studies) {
    const first = await db('study_revisions').where({ study_id: study.id, number: 1 }).first()
    if (!first || first.results !== null) continue
    const input = evaluateInputSchema.parse({ spec: json(first.spec), process: json(first.process), options: json(first.options) })
    const started = performance.now()
    const results = await applyFindings(input, evaluateSpec(input))
    const seconds = (performance.now() - started) / 1000
    await db.transaction(async (trx) => {
      const locked = await trx('studies').where({ id: study.id }).forUpdate().first('version')
      if (locked.version !== 1) return
      await writeRevision(trx, {
        studyId: study.id, number: 2, inputs: input, results, weights: first.weights === null ? null : json(first.weights), engineVersion: ENGINE_VERSION,
        note: 'Demo data: the first inputs, evaluated by the engine when the demo was set up', authorId: study.owner_id
      })
      await trx('audit_log').insert({
        team_id: team.id, actor_id: study.owner_id, action: 'revision_saved', target_type: 'study', target_id: study.id,
        detail: JSON.stringify({ number: 2, withResults: true, source: 'demo set-up' })
      })
    })
    console.log(`Evaluated demo study "${study.title}" in ${seconds.toFixed(1)} s`)
  }
}

main()
  .catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error)
    process.exitCode = 1
  })
  .finally(() => db.destroy())
