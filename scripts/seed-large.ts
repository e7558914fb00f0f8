/**
 * `npm run db:seed:large`: a separate bench team ("Scale Bench", invented) with 10,000 studies
 * (revisions and portfolio summaries) and 100,000 notes (threads, replies, some resolved), for the
 * list and portfolio benchmarks (`npm run bench`, section scale). Idempotent: a team that already
 * has its studies is left as it is. Sign in as manager@scalebench.example (password below).
 * The connection comes from NUXT_DATABASE_URL (default: the private instance of scripts/db.sh).
 */
import bcrypt from 'bcryptjs'
import knex, { type Knex } from 'knex'
import { pathToFileURL } from 'node:url'
import { knexConfig } from '../server/db/knexfile'
import { seedLargeNotes, type NotesSeedResult } from './seed-large/notes'
import { seedLargeStudies } from './seed-large/studies'
import { evaluateVariants } from './seed-large/variants'

export const LARGE_TEAM = { name: 'Scale Bench', slug: 'scale-bench' }
export const LARGE_PASSWORD = 'scale-bench-demo'
export const LARGE_USERS = [
  { email: 'admin@scalebench.example', display_name: 'Bench Admin', role: 'admin' },
  { email: 'architect@scalebench.example', display_name: 'Bench Architect', role: 'architect' },
  { email: 'engineer@scalebench.example', display_name: 'Bench Engineer', role: 'engineer' },
  { email: 'manager@scalebench.example', display_name: 'Bench Manager', role: 'manager' }
] as const

export interface LargeSeedOptions { studies?: number, notes?: number, batch?: number, log?: (line: string) => void }
export interface LargeSeedResult { teamId: number, studies: number, studiesSeconds: number, notes: NotesSeedResult, notesSeconds: number }

async function ensureTeam(db: Knex): Promise<{ teamId: number, userIds: number[] }> {
  await db('teams').insert(LARGE_TEAM).onConflict('slug').merge(['name'])
  const team = await db('teams').where({ slug: LARGE_TEAM.slug }).first('id')
  const hash = await bcrypt.hash(LARGE_PASSWORD, 12)
  for (const user of LARGE_USERS) {
    await db('users').insert({ ...user, team_id: team.id, password_hash: hash, active: true }).onConflict('email').ignore()
  }
  const users = await db('users').where({ team_id: team.id }).orderBy('id').select('id')
  return { teamId: team.id, userIds: users.map(u => u.id) }
}

/** Seeds the bench team; studies only when the team has none yet, notes only when it has none. */
export async function seedLargeTeam(db: Knex, options: LargeSeedOptions = {}): Promise<LargeSeedResult> {
  const log = options.log ?? (() => undefined)
  const count = options.studies ?? 10_000
  const { teamId, userIds } = await ensureTeam(db)
  let t0 = performance.now()
  const existing = Number((await db('studies').where({ team_id: teamId }).count({ n: '*' }))[0]?.n ?? 0)
  let studyIds: number[]
  if (existing > 0) {
    log(`team ${LARGE_TEAM.slug} already has ${existing} studies: left as they are`)
    studyIds = (await db('studies').where({ team_id: teamId }).orderBy('id').select('id')).map(r => r.id)
  } else {
    const variants = await evaluateVariants()
    log(`evaluated ${variants.length} spec variants with the engine in ${((performance.now() - t0) / 1000).toFixed(1)} s`)
    studyIds = await seedLargeStudies(db, teamId, userIds, variants, { count, batch: options.batch ?? 1000, evaluatedShare: 0.6 })
    log(`inserted ${studyIds.length} studies with revisions in ${((performance.now() - t0) / 1000).toFixed(1)} s`)
  }
  const studiesSeconds = (performance.now() - t0) / 1000
  t0 = performance.now()
  const notes = await seedLargeNotes(db, teamId, studyIds, userIds, options.notes ?? 100_000)
  const notesSeconds = (performance.now() - t0) / 1000
  log(notes.skipped ? `notes: skipped, ${notes.skipped}` : `inserted ${notes.inserted} notes in ${notesSeconds.toFixed(1)} s`)
  return { teamId, studies: studyIds.length, studiesSeconds, notes, notesSeconds }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const db = knex(knexConfig())
  seedLargeTeam(db, { log: line => console.log(`[seed:large] ${line}`) })
    .then(r => console.log(`[seed:large] done: team ${r.teamId}, ${r.studies} studies, ${r.notes.inserted} notes; sign in as ${LARGE_USERS[3].email} / ${LARGE_PASSWORD}`))
    .catch((error: unknown) => {
      console.error(error instanceof Error ? error.message : error)
      process.exitCode = 1
    })
    .finally(() => db.destroy())
}
