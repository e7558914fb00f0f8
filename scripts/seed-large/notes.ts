/**
 * The notes part of the large bench team: 100,000 notes spread over its studies. The notes table
 * comes with the notes work; until it exists this step says so and does nothing. When it lands,
 * check NOTE_COLUMNS against its migration (the first matching column name of each list is used).
 */
import type { Knex } from 'knex'

const NOTE_COLUMNS = {
  study: ['study_id'],
  author: ['author_id', 'user_id'],
  body: ['body', 'body_md', 'markdown', 'text']
} as const

export interface NotesSeedResult { inserted: number, skipped: string | null }

async function pickColumns(knex: Knex): Promise<Record<keyof typeof NOTE_COLUMNS, string> | string> {
  const info = await knex('notes').columnInfo()
  if (!('created_at' in info)) return 'table notes has no created_at column; update scripts/seed-large/notes.ts'
  const picked: Partial<Record<keyof typeof NOTE_COLUMNS, string>> = {}
  for (const [key, names] of Object.entries(NOTE_COLUMNS) as [keyof typeof NOTE_COLUMNS, readonly string[]][]) {
    const name = names.find(n => n in info)
    if (!name) return `table notes has none of ${names.join(', ')}; update NOTE_COLUMNS in scripts/seed-large/notes.ts`
    picked[key] = name
  }
  return picked as Record<keyof typeof NOTE_COLUMNS, string>
}

/** Inserts `count` notes round-robin over the studies, in transactions of `batch` rows. */
export async function seedLargeNotes(knex: Knex, studyIds: number[], authorIds: number[], count = 100_000, batch = 5000): Promise<NotesSeedResult> {
  if (!(await knex.schema.hasTable('notes'))) return { inserted: 0, skipped: 'table notes does not exist yet (it comes with the notes work)' }
  const columns = await pickColumns(knex)
  if (typeof columns === 'string') return { inserted: 0, skipped: columns }
  if (!studyIds.length) return { inserted: 0, skipped: 'no studies to attach notes to' }
  const already = Number((await knex('notes').whereIn(columns.study, studyIds.slice(0, 1000)).count({ n: '*' }))[0]?.n ?? 0)
  if (already > 0) return { inserted: 0, skipped: 'the bench team already has notes' }
  const hasUpdatedAt = 'updated_at' in (await knex('notes').columnInfo())
  const start = Date.now() - 365 * 86_400_000
  for (let from = 0; from < count; from += batch) {
    const rows: Record<string, unknown>[] = []
    for (let i = from; i < Math.min(count, from + batch); i++) {
      const at = new Date(start + Math.floor((i / count) * 365 * 86_400_000))
      rows.push({
        [columns.study]: studyIds[i % studyIds.length], [columns.author]: authorIds[i % authorIds.length],
        [columns.body]: `Seeded bench note ${i + 1}: check the **INL** margin of the chosen candidate against the spec.`,
        created_at: at, ...(hasUpdatedAt ? { updated_at: at } : {})
      })
    }
    await knex.transaction(trx => trx('notes').insert(rows))
  }
  return { inserted: count, skipped: null }
}
