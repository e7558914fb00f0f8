/**
 * The facts a rule may test and the fields inside each, so a pack that names an unknown field is
 * refused when it loads rather than silently never firing.
 */
import { evaluateProcessSchema, evaluateSpecSchema } from '../core/contract/evaluate'

export const FACTS = ['spec', 'process', 'candidate', 'metrics', 'derived'] as const
export type FactName = typeof FACTS[number]

/** Candidate metric names (SI units) that rules may read; the engine's output fixes them. */
export const METRIC_FIELDS = [
  'resistorCount', 'unitResistorCount', 'switchCount', 'switchesInPath', 'decoderGateCount', 'bufferCount',
  'unitOhm', 'unitWidthUm', 'unitLengthUm', 'unitAreaUm2', 'matchingAreaUm2', 'sigmaUnit', 'sigmaUnitRequired',
  'sizingLimitedBy', 'resistorAreaMm2', 'switchAreaMm2', 'decoderAreaMm2', 'totalAreaMm2', 'areaBudgetShare',
  'inlSigmaLsb', 'dnlSigmaLsb', 'inlYield', 'dnlYield', 'monotonicYield', 'yield', 'yieldLow', 'yieldHigh',
  'yieldSource', 'systematicInlLsb', 'systematicDnlLsb', 'loadedInlLsb', 'glitchWorstVs', 'glitchWorstFromCode',
  'glitchWorstToCode', 'glitchMajorCarryVs', 'irefMinA', 'irefMaxA', 'rinMinOhm', 'rinMaxOhm', 'refLoadCodeDependent',
  'refSourceMaxOhm', 'refInlAtSourceLsb', 'bufferNeeded', 'routMinOhm', 'routMaxOhm', 'tauS', 'settlingS',
  'maxUpdateRateHz', 'noiseVrms', 'refPowerMaxW', 'refPowerMeanW'
] as const

/** Quantities the findings runner derives from spec, process and metrics (see facts.ts). */
export const DERIVED_FIELDS = [
  'binaryBits', 'lsbV', 'elementCount', 'areaToBudget', 'resistorAreaToBudget', 'matchingLimited', 'glitchToLimit',
  'majorCarryToLimit', 'updateRateRatio', 'refPowerToBudget', 'refSourceToMax', 'inlYieldShortfall',
  'dnlYieldShortfall', 'monotonicShortfall', 'dnlWorstCaseLsb', 'systematicDnlMinLsb', 'systematicDnlToTarget', 'loadGainErrorLsb',
  'noiseGainMin', 'noiseGainMax', 'noiseGainSpan', 'smallestUnaryForDnlGlitch', 'isSmallestUnaryForDnlGlitch'
] as const

export const CANDIDATE_FIELDS = ['id', 'topology', 'unaryBits', 'coarseBits', 'decode', 'buffered'] as const

/** Known fields per fact. */
export const FACT_FIELDS: Record<FactName, readonly string[]> = {
  spec: Object.keys(evaluateSpecSchema.shape),
  process: Object.keys(evaluateProcessSchema.shape),
  candidate: CANDIDATE_FIELDS,
  metrics: METRIC_FIELDS,
  derived: DERIVED_FIELDS
}

/** True when `fact.field` names something a rule can read. */
export function isKnownField(fact: string, field: string): boolean {
  return (FACTS as readonly string[]).includes(fact) && FACT_FIELDS[fact as FactName].includes(field)
}
