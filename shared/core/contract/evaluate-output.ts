/**
 * Output contract of evaluate: `engineVersion`, `candidates[]` with fixed metric names (SI units,
 * `null` where a quantity does not apply) and detail sections, plus `cautions`. The schema checks
 * the fixed fields and lets added fields through, so outputs stay forward compatible.
 */
import { z } from 'zod'

const num = z.number()
const maybe = z.number().nullable()

/** Fixed metric names of every candidate (never rename; add fields instead). */
export const REQUIRED_METRICS = [
  'resistorCount', 'unitResistorCount', 'switchCount', 'decoderGateCount', 'unitAreaUm2', 'resistorAreaMm2',
  'switchAreaMm2', 'totalAreaMm2', 'inlSigmaLsb', 'dnlSigmaLsb', 'inlYield', 'dnlYield', 'monotonicYield',
  'glitchWorstVs', 'glitchWorstFromCode', 'glitchWorstToCode', 'rinMinOhm', 'rinMaxOhm', 'irefMaxA',
  'refSourceMaxOhm', 'routMaxOhm', 'tauS', 'settlingS', 'maxUpdateRateHz', 'noiseVrms', 'refPowerMaxW'
] as const

const metricsShape = Object.fromEntries(REQUIRED_METRICS.map(k => [k, maybe])) as Record<typeof REQUIRED_METRICS[number], typeof maybe>

export const candidateMetricsSchema = z.looseObject(metricsShape)

const series = z.object({ codes: z.array(num), min: z.array(maybe), max: z.array(maybe) })

export const evaluateCandidateSchema = z.looseObject({
  id: z.string(),
  topology: z.enum(['string', 'r2r-voltage', 'r2r-current', 'segmented', 'two-stage-string']),
  unaryBits: z.number().int().nullable(),
  metrics: candidateMetricsSchema,
  meetsSpec: z.boolean(),
  failing: z.array(z.string()),
  linearity: z.looseObject({ definition: z.enum(['endpoint', 'best-fit']), monteCarlo: z.looseObject({ trials: num }).nullable() }),
  glitch: z.looseObject({ perTransition: series }),
  reference: z.looseObject({ irefA: series, rinOhm: series }),
  output: z.looseObject({ routOhm: series })
})

export const evaluateOutputSchema = z.looseObject({
  engineVersion: z.string(),
  candidates: z.array(evaluateCandidateSchema),
  cautions: z.array(z.string())
})

export type CandidateMetrics = z.infer<typeof candidateMetricsSchema>
export type EvaluateCandidate = z.infer<typeof evaluateCandidateSchema>
export type EvaluateOutput = z.infer<typeof evaluateOutputSchema>
