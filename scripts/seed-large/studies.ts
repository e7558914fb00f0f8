/**
 * The studies of the large bench team: 10,000 studies with their revisions and the summary_*
 * columns the portfolio lists, inserted in batches, one transaction per batch.
 */
import type { Knex } from 'knex'
import { ENGINE_VERSION } from '../../shared/core/version'
import type { SpecVariant } from './variants'

const BLOCKS = ['Sensor trim', 'Bias generator', 'Actuator set point', 'Audio path', 'Calibration', 'LED current', 'Comparator threshold', 'Reference buffer']
const STATUSES = ['draft', 'draft', 'in_review', 'decided', 'archived'] as const
const DAY_MS = 86_400_000

export interface StudySeedOptions { count: number, batch: number, evaluatedShare: number }

/** Title of bench study i (unique within the team, so rows can be found again by title). */
export const benchTitle = (i: number, bits: number) => `${BLOCKS[i % BLOCKS.length]} DAC ${bits} bit, bench study ${String(i + 1).padStart(5, '0')}`

interface BatchContext { teamId: number, ownerIds: number[], variants: SpecVariant[], options: StudySeedOptions, now: number }

function studyRow(ctx: BatchContext, i: number) {
  const variant = ctx.variants[i % ctx.variants.length]!
  // Deterministic spread: every share of studies evaluated, updated over the past year.
  const evaluated = ((i * 7919) % 1000) / 1000 < ctx.options.evaluatedShare
  const updated = new Date(ctx.now - ((i * 104_729) % 365_000) * (DAY_MS / 1000))
  const s = evaluated ? variant.summary : null
  return {
    row: {
      team_id: ctx.teamId, owner_id: ctx.ownerIds[i % ctx.ownerIds.length], title: benchTitle(i, variant.input.spec.bits),
      block_name: `${BLOCKS[(i >> 3) % BLOCKS.length]} — channel ${i % 64}`, status: STATUSES[i % STATUSES.length],
      spec: JSON.stringify(variant.input.spec), version: evaluated ? 2 : 1, created_at: new Date(updated.getTime() - 30 * DAY_MS), updated_at: updated,
      summary_candidate_id: s?.candidateId ?? null, summary_area_mm2: s?.areaMm2 ?? null, summary_fail_count: s?.failCount ?? null,
      summary_meeting_count: s?.meetingCount ?? null, summary_candidate_count: s?.candidateCount ?? null
    },
    variant,
    evaluated
  }
}

function revisionRows(studyId: number, authorId: number, variant: SpecVariant, evaluated: boolean, updated: Date) {
  const base = {
    study_id: studyId, spec: JSON.stringify(variant.input.spec), process: JSON.stringify(variant.input.process),
    options: JSON.stringify(variant.input.options), engine_version: ENGINE_VERSION, results: null, author_id: authorId
  }
  const first = { ...base, number: 1, note: 'Bench data: first inputs', created_at: new Date(updated.getTime() - 30 * DAY_MS) }
  if (!evaluated) return [first]
  // The summary columns come from an engine run of this exact spec; its output (about 0.2 MB) is
  // not copied into thousands of revisions, so the seed stays small and quick.
  return [first, { ...base, number: 2, note: 'Bench data: evaluated (summary only, results not stored)', created_at: updated }]
}

/** Inserts the studies batch by batch; returns their ids in insertion order. */
export async function seedLargeStudies(knex: Knex, teamId: number, ownerIds: number[], variants: SpecVariant[], options: StudySeedOptions): Promise<number[]> {
  const ctx: BatchContext = { teamId, ownerIds, variants, options, now: Date.now() }
  const ids: number[] = []
  for (let from = 0; from < options.count; from += options.batch) {
    const planned: ReturnType<typeof studyRow>[] = []
    for (let i = from; i < Math.min(options.count, from + options.batch); i++) planned.push(studyRow(ctx, i))
    await knex.transaction(async (trx) => {
      await trx('studies').insert(planned.map(p => p.row))
      // Auto-increment ids need not be consecutive (Galera, lock mode 2): read them back by title.
      const found: { id: number, title: string }[] = await trx('studies').where({ team_id: teamId }).whereIn('title', planned.map(p => p.row.title)).select('id', 'title')
      const idOf = new Map(found.map(r => [r.title, r.id]))
      const revisions = planned.flatMap(p => revisionRows(idOf.get(p.row.title)!, p.row.owner_id!, p.variant, p.evaluated, p.row.updated_at))
      await trx('study_revisions').insert(revisions)
      ids.push(...planned.map(p => idOf.get(p.row.title)!))
    })
  }
  return ids
}
