/**
 * What a person calls each fact a rule can read: the metric and derived names are the contract's
 * (fixed, camelCase, SI units in the name); the screen shows these words instead. Spec and process
 * fields take their label from the field catalogue (shared/schemas/fields.ts).
 */
import { FIELDS, findField, type FieldSection } from '../schemas/fields'
import type { FactName } from './fields'

export const METRIC_LABELS: Record<string, string> = {
  resistorCount: 'resistors', unitResistorCount: 'unit resistors', switchCount: 'switches', switchesInPath: 'switches in the signal path',
  decoderGateCount: 'decoder gates', bufferCount: 'buffers', unitOhm: 'unit resistor value', unitWidthUm: 'unit width',
  unitLengthUm: 'unit length', unitAreaUm2: 'unit area', matchingAreaUm2: 'unit area needed for matching', sigmaUnit: 'σ of one unit',
  sigmaUnitRequired: 'σ of one unit the targets need', sizingLimitedBy: 'what sets the unit size', resistorAreaMm2: 'resistor area',
  switchAreaMm2: 'switch area', decoderAreaMm2: 'decoder area', totalAreaMm2: 'total area', areaBudgetShare: 'share of the area budget',
  inlSigmaLsb: 'σ of INL', dnlSigmaLsb: 'σ of DNL at the worst step', inlYield: 'INL yield', dnlYield: 'DNL yield',
  monotonicYield: 'monotonic yield', yield: 'yield (all limits)', yieldLow: 'yield, lower confidence bound', yieldHigh: 'yield, upper confidence bound',
  yieldSource: 'where the yield comes from', systematicInlLsb: 'systematic INL (nominal circuit)', systematicDnlLsb: 'systematic |DNL| (nominal circuit)',
  loadedInlLsb: 'INL with the load resistance', glitchWorstVs: 'worst glitch impulse', glitchWorstFromCode: 'worst glitch: from code',
  glitchWorstToCode: 'worst glitch: to code', glitchMajorCarryVs: 'glitch at the major carry', irefMinA: 'least reference current',
  irefMaxA: 'largest reference current', rinMinOhm: 'least reference input resistance', rinMaxOhm: 'largest reference input resistance',
  refLoadCodeDependent: 'reference load changes with the code', refSourceMaxOhm: 'largest reference source resistance allowed',
  refInlAtSourceLsb: 'INL from the reference source resistance', bufferNeeded: 'output buffer needed', routMinOhm: 'least output resistance',
  routMaxOhm: 'largest output resistance', tauS: 'output time constant', settlingS: 'settling time', maxUpdateRateHz: 'fastest update rate',
  noiseVrms: 'output noise', refPowerMaxW: 'largest reference power', refPowerMeanW: 'mean reference power',
  inlYieldAnalytic: 'fast INL yield', dnlYieldAnalytic: 'fast DNL yield', monotonicYieldAnalytic: 'fast monotonic yield',
  yieldAnalytic: 'fast yield (all limits)', fastYieldModel: 'how the fast yields were found', fastYieldTrials: 'circuits in the sizing sample',
  sizingFeasible: 'a unit size meets the yield target', switchHandling: 'switch handling', switchScale: 'switch width (× the process switch)'
}

/** Steps the explanations record on the way to a metric (shared/core/explain), in words. */
export const STEP_LABELS: Record<string, string> = {
  inlYieldAnalytic: 'INL yield (fast estimate)', dnlYieldAnalytic: 'DNL yield (fast estimate)', monotonicYieldAnalytic: 'monotonic yield (fast estimate)',
  noiseKtcVrms: 'kT/C noise', noisePoleHz: 'noise bandwidth', quantNoiseVrms: 'quantisation noise', routEffMaxOhm: 'driving resistance with the load',
  tauMaxS: 'longest time constant allowed', sigmaForDnl: 'σ of one unit the DNL target needs', sigmaForInl: 'σ of one unit the INL target needs',
  unitOhmArea: 'unit value for the least area', unitOhmPower: 'least unit value for the power budget', unitOhmSettling: 'largest unit value for settling',
  aSingleUm: 'matching coefficient of one device', squares: 'squares of the unit resistor'
}

export const DERIVED_LABELS: Record<string, string> = {
  binaryBits: 'binary-weighted bits', lsbV: 'one LSB', elementCount: 'resistors and switches', areaToBudget: 'area / area budget',
  resistorAreaToBudget: 'resistor area / area budget', matchingLimited: 'unit size set by matching', glitchToLimit: 'worst glitch / glitch limit',
  majorCarryToLimit: 'major-carry glitch / glitch limit', updateRateRatio: 'fastest update rate / required rate',
  refPowerToBudget: 'reference power / power budget', refSourceToMax: 'reference source resistance / largest allowed',
  inlYieldShortfall: 'INL yield short of the target by', dnlYieldShortfall: 'DNL yield short of the target by',
  monotonicShortfall: 'monotonic yield short of the target by', dnlWorstCaseLsb: '3σ of DNL plus its systematic part',
  systematicDnlMinLsb: 'most negative nominal DNL step (signed)', systematicDnlToTarget: 'systematic |DNL| / DNL target',
  loadGainErrorLsb: 'error from the load divider', noiseGainMin: 'least I-V noise gain', noiseGainMax: 'largest I-V noise gain',
  noiseGainSpan: 'I-V noise gain swing (largest / least)', smallestUnaryForDnlGlitch: 'fewest unary MSBs meeting DNL and glitch',
  isSmallestUnaryForDnlGlitch: 'is the fewest unary MSBs meeting DNL and glitch'
}

export const CANDIDATE_LABELS: Record<string, string> = {
  id: 'candidate', topology: 'architecture', unaryBits: 'unary MSBs', coarseBits: 'coarse bits', decode: 'string decoder', buffered: 'buffered between stages'
}

/** Contract fields the form catalogue does not list (yet): their words here. */
const UNLISTED_FIELDS: Record<string, string> = {
  refInlBudgetLsb: 'INL budget for the reference source', twoRConstruction: '2R construction', temperatureK: 'temperature',
  latchDelayS: 'latch delay', bufferOffsetSigmaV: 'σ of buffer offset', tapChargeFraction: 'share of tap switch charge reaching the output',
  legChargeFraction: 'share of leg switch charge reaching the output', envelopePoints: 'points per chart series',
  confidence: 'confidence of the yield intervals', inlDefinition: 'INL line (end-point or best-fit)', topologies: 'architectures to compare'
}

/** The words for each fact. */
export const FACT_WORDS: Record<FactName, string> = {
  spec: 'Target', process: 'Process', candidate: 'Candidate', metrics: 'Result', derived: 'Derived'
}

/** A person's name for `fact.field` (the field itself when nothing better is known). */
export function factLabel(fact: string, field: string): string {
  if (fact === 'spec' || fact === 'process') return findField(fact as FieldSection, field)?.label ?? UNLISTED_FIELDS[field] ?? field
  const table = fact === 'metrics' ? { ...STEP_LABELS, ...METRIC_LABELS } : fact === 'derived' ? DERIVED_LABELS : fact === 'candidate' ? CANDIDATE_LABELS : {}
  return table[field] ?? field
}

/** The label of a basis entry or explanation key: `totalAreaMm2` (a metric), `derived.areaToBudget`, or an input field. */
export function metricLabel(name: string): string {
  if (!name.includes('.') && !(name in METRIC_LABELS) && !(name in STEP_LABELS)) {
    const field = FIELDS.find(f => f.key === name)
    if (field) return field.label
    if (name in UNLISTED_FIELDS) return UNLISTED_FIELDS[name]!
  }
  const [fact, field] = name.includes('.') ? name.split('.', 2) as [string, string] : ['metrics', name]
  return factLabel(fact, field)
}
