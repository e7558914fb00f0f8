/**
 * Ranking weights a study sets: one per criterion, 0 (ignored) to 10. The defaults and the reason
 * for each are shown beside the weights editor.
 */
import { z } from 'zod'

export const CRITERIA = ['area', 'yieldMargin', 'glitch', 'referenceLoad', 'settlingMargin', 'power', 'complexity'] as const
export type Criterion = typeof CRITERIA[number]
export type RankingWeights = Record<Criterion, number>

export const MAX_WEIGHT = 10

export const DEFAULT_WEIGHTS: RankingWeights = {
  area: 3, yieldMargin: 2, glitch: 1, referenceLoad: 1, settlingMargin: 1, power: 1, complexity: 1
}

/** What each criterion measures and why its default weight is what it is. */
export const CRITERION_INFO: Record<Criterion, { label: string, measures: string, why: string }> = {
  area: { label: 'Area', measures: 'total area (log scale)', why: 'Silicon cost is usually what separates options that all meet spec, so it weighs most (3).' },
  yieldMargin: { label: 'Yield margin', measures: 'overall yield above the target, in parts per million lost', why: 'Headroom over the yield target protects against optimistic matching data (2).' },
  glitch: { label: 'Glitch', measures: 'worst glitch impulse (log scale)', why: 'Matters for waveform and control loops; the limit itself is a hard rule (1).' },
  referenceLoad: { label: 'Reference load', measures: 'peak reference current (log scale)', why: 'A larger, code-dependent load costs buffer power and area (1).' },
  settlingMargin: { label: 'Settling margin', measures: 'fastest update rate over the required one (log scale)', why: 'Headroom over a first-order settling estimate (1).' },
  power: { label: 'Power', measures: 'peak reference power (log scale)', why: 'Usually small next to the buffers; the budget itself is a hard rule (1).' },
  complexity: { label: 'Complexity', measures: 'switches, decoder gates and buffers (log scale)', why: 'More elements mean more layout, verification and test (1).' }
}

const weight = z.number({ error: `must be a number from 0 to ${MAX_WEIGHT}` }).min(0, `must be a number from 0 to ${MAX_WEIGHT}`).max(MAX_WEIGHT, `must be a number from 0 to ${MAX_WEIGHT}`)

export const rankingWeightsSchema = z.strictObject(Object.fromEntries(CRITERIA.map(c => [c, weight.default(DEFAULT_WEIGHTS[c])])) as Record<Criterion, z.ZodDefault<typeof weight>>)
  .refine(w => CRITERIA.some(c => w[c] > 0), { message: 'at least one weight must be above 0' })
