/**
 * The studies of the large bench team: 10,000 studies with their revisions and the summary_*
 * columns the portfolio lists, inserted in batches, one transaction per batch.
 */
import type { Knex } from 'knex'
import { ENGINE_VERSION } from '../../shared/core/version'
import { revisionRecord } from '../../server/db/writeRevision'
import type { SpecVariant } from './variants'

const BLOCKS = ['Sensor trim', 'Bias generator', 'Actuator set point', 'Audio path', 'Calibration', 'LED current', 'Comparator threshold', 'Reference buffer']
const STATUSES = ['draft', 'draft', 'in_review', 'decided', 'archived'] as const
const DAY_MS = 86_400_000

export interface StudySeedOptions { count: number, batch: number, evaluatedShare: number }

/** Title of bench study i (unique within the team, so rows can be found again by title). */
export const benchTitle = (i: number, bits: number) => `${BLOCKS[i % BLOCKS.length]} DAC ${bits} bit, bench study ${String(i + 1).padStart(5, '0')}`

/**
 * A variant's two revision records, built once by writeRevision's revisionRecord (the study id,
 * author and number are filled in per study). The evaluated one keeps the recommendation and the
 * summary but not the output itself (about 0.2 MB), so the seed stays small and quick.
 */
interface SeedVariant { input: SpecVariant['input'], inputsOnly: ReturnType<typeof revisionRecord>, evaluated: ReturnType<typeof revisionRecord> }

function seedVariant(v: SpecVariant): SeedVariant {
  const base = { studyId: 0, number: 1, inputs: v.input, weights: null, engineVersion: ENGINE_VERSION, authorId: 0 }
  return {
    input: v.input,
    inputsOnly: revisionRecord({ ...base, results: null, note: 'Bench data: first inputs' }),
    evaluated: revisionRecord({ ...base, number: 2, results: v.results, storeResults: false, note: 'Bench data: evaluated (recommendation and summary only, results not stored)' })
  }
}

interface BatchContext { teamId: number, ownerIds: number[], variants: SeedVariant[], options: StudySeedOptions, now: number }

function studyRow(ctx: BatchContext, i: number) {
  const variant = ctx.variants[i % ctx.variants.length]!
  // Deterministic spread: every share of studies evaluated, updated over the past year.
  const evaluated = ((i * 7919) % 1000) / 1000 < ctx.options.evaluatedShare
  const updated = new Date(ctx.now - ((i * 104_729) % 365_000) * (DAY_MS / 1000))
  // The study's columns as writeRevision leaves them after its head revision (the variant's own record).
  const head = evaluated ? variant.evaluated : variant.inputsOnly
  return {
    row: {
      team_id: ctx.teamId, owner_id: ctx.ownerIds[i % ctx.ownerIds.length], title: benchTitle(i, variant.input.spec.bits),
      block_name: `${BLOCKS[(i >> 3) % BLOCKS.length]} — channel ${i % 64}`, status: STATUSES[i % STATUSES.length],
      created_at: new Date(updated.getTime() - 30 * DAY_MS), ...head.study, updated_at: updated
    },
    variant,
    evaluated
  }
}

/** The revision rows of one study: the inputs, and (evaluated) a second revision with the recommendation. */
function revisionRows(studyId: number, authorId: number, variant: SeedVariant, evaluated: boolean, updated: Date) {
  const at = (number: number, created: Date, r: SeedVariant['evaluated']) => ({ ...r.revision, study_id: studyId, author_id: authorId, number, created_at: created })
  const first = at(1, new Date(updated.getTime() - 30 * DAY_MS), variant.inputsOnly)
  if (!evaluated) return [first]
  return [first, at(2, updated, variant.evaluated)]
}

/** Inserts the studies batch by batch; returns their ids in insertion order. */
export async function seedLargeStudies(knex: Knex, teamId: number, ownerIds: number[], specVariants: SpecVariant[], options: StudySeedOptions): Promise<number[]> {
  const ctx: BatchContext = { teamId, ownerIds, variants: specVariants.map(seedVariant), options, now: Date.now() }
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
