/**
 * The notes part of the large bench team: 100,000 notes spread over its studies, in the columns of
 * migrations/20261202010000_notes.ts. Each study gets threads anchored on the study at its head
 * revision; every third note on a study is a reply to the one before it there, and every fourth
 * thread starter is resolved. body_html comes from the renderer the notes routes use
 * (server/utils/noteMarkdown.ts, which needs no Nitro auto-imports), so the seeded rows read like
 * written ones. Invented bench text, not engineering advice.
 */
import type { Knex } from 'knex'
import { renderNoteMarkdown } from '../../server/utils/noteMarkdown'

export interface NotesSeedResult { inserted: number, skipped: string | null }

const BODIES = [
  (i: number) => `Bench note ${i}: check the **INL** margin of the chosen candidate against the spec.`,
  (i: number) => `Bench note ${i}: the area estimate looks tight; compare with the segmented option before sign-off.`,
  (i: number) => `Bench note ${i}:\n- rerun with more Monte Carlo trials\n- keep the seed in the revision note`,
  (i: number) => `Bench note ${i}: agreed, the *DNL* target holds at this matching figure.`
] as const

/** The head revision number of each study (0 when it has none). */
async function headRevisions(knex: Knex, studyIds: number[]): Promise<Map<number, number>> {
  const heads = new Map<number, number>()
  for (let from = 0; from < studyIds.length; from += 5000) {
    const rows: { study_id: number, n: number }[] = await knex('study_revisions').whereIn('study_id', studyIds.slice(from, from + 5000))
      .groupBy('study_id').select('study_id').max({ n: 'number' })
    for (const r of rows) heads.set(r.study_id, Number(r.n))
  }
  return heads
}

/** Inserts `count` notes round-robin over the studies, in transactions of `batch` rows (starters first, then replies). */
export async function seedLargeNotes(knex: Knex, teamId: number, studyIds: number[], authorIds: number[], count = 100_000, batch = 5000): Promise<NotesSeedResult> {
  if (!(await knex.schema.hasTable('notes'))) return { inserted: 0, skipped: 'table notes does not exist (run npm run db:migrate)' }
  if (!studyIds.length) return { inserted: 0, skipped: 'no studies to attach notes to' }
  if (!authorIds.length) return { inserted: 0, skipped: 'no team members to write notes' }
  const already = Number((await knex('notes').where({ team_id: teamId }).count({ n: '*' }))[0]?.n ?? 0)
  if (already > 0) return { inserted: 0, skipped: 'the bench team already has notes' }
  const heads = await headRevisions(knex, studyIds)
  const start = Date.now() - 365 * 86_400_000
  const row = (i: number, parentId: number | null, resolvedBy: number | null) => {
    const at = new Date(start + Math.floor((i / count) * 365 * 86_400_000))
    const studyId = studyIds[i % studyIds.length]!
    const body = BODIES[i % BODIES.length]!(i + 1)
    return {
      team_id: teamId, study_id: studyId, parent_id: parentId, anchor_type: 'study', candidate_id: null, metric_key: null,
      revision: heads.get(studyId) ?? 0, metric_value: null, body, body_html: renderNoteMarkdown(body),
      author_id: authorIds[i % authorIds.length], version: 1,
      resolved_at: resolvedBy === null ? null : at, resolved_by: resolvedBy, created_at: at, updated_at: at
    }
  }
  // The k-th note on a study (k = floor(i / studies)) is a reply when k % 3 === 2: to the note just
  // before it on that study, a thread starter of this batch or an earlier one.
  const isReply = (i: number) => Math.floor(i / studyIds.length) % 3 === 2
  const ids = new Map<number, number>()
  let inserted = 0
  for (let from = 0; from < count; from += batch) {
    const to = Math.min(count, from + batch)
    await knex.transaction(async (trx) => {
      const starters: number[] = []
      const replies: number[] = []
      for (let i = from; i < to; i++) (isReply(i) ? replies : starters).push(i)
      let firstId = Infinity
      for (let k = 0; k < starters.length; k += 1000) {
        const [first] = await trx('notes').insert(starters.slice(k, k + 1000).map(i => row(i, null, i % 4 === 0 ? authorIds[(i + 1) % authorIds.length]! : null)))
        firstId = Math.min(firstId, first!)
      }
      // The starters' ids, read back by the note number in their body (ids need not be consecutive).
      if (starters.length) {
        const back: { id: number, body: string }[] = await trx('notes').where({ team_id: teamId }).where('id', '>=', firstId).whereNull('parent_id').select('id', 'body')
        for (const r of back) ids.set(Number(/^Bench note (\d+):/.exec(r.body)?.[1]) - 1, r.id)
      }
      for (let k = 0; k < replies.length; k += 1000) {
        await trx('notes').insert(replies.slice(k, k + 1000).map(i => row(i, ids.get(i - studyIds.length)!, null)))
      }
    })
    inserted += to - from
  }
  return { inserted, skipped: null }
}
