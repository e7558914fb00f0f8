/**
 * Assembles one output candidate: the fixed metric names (SI units, null where not applicable),
 * the detail sections and the list of spec items it fails.
 */
import type { EvaluateInput } from '../contract/evaluate'
import type { McTally } from '../stats/accumulator'
import { wilsonInterval } from '../stats/interval'
import type { AnalyticCandidate } from './analytic'
import type { CandidateContext } from './context'
import { linearitySection } from './linearity-output'

function finiteOrNull(x: number | null): number | null {
  return x !== null && Number.isFinite(x) ? x : null
}

function yields(a: AnalyticCandidate, t: McTally | null, input: EvaluateInput) {
  if (t && t.trials > 0) {
    const all = wilsonInterval(t.allPass, t.trials, input.options.confidence)
    return { inlYield: t.inlPass / t.trials, dnlYield: t.dnlPass / t.trials, monotonicYield: t.monoPass / t.trials, yield: all.yield, yieldLow: all.low, yieldHigh: all.high, yieldSource: 'monte-carlo' }
  }
  const { inlYield, dnlYield, monotonicYield } = a.analytic
  return { inlYield, dnlYield, monotonicYield, yield: a.analytic.yield, yieldLow: null, yieldHigh: null, yieldSource: 'analytic' }
}

/** The metrics object of one candidate. */
export function candidateMetrics(c: CandidateContext, a: AnalyticCandidate, t: McTally | null, input: EvaluateInput) {
  const r = a.reference
  const g = a.glitch
  return {
    ...a.counts,
    unitOhm: c.sizing.unitOhm,
    unitOhmChoice: c.sizing.unitOhmChoice,
    unitWidthUm: c.sizing.unitWidthUm,
    unitLengthUm: c.sizing.unitLengthUm,
    unitAreaUm2: c.sizing.unitAreaUm2,
    matchingAreaUm2: c.sizing.matchingAreaUm2,
    sigmaUnit: c.sizing.sigmaUnit,
    sigmaUnitRequired: c.sizing.sigmaRequired,
    sizingLimitedBy: c.sizing.limitedBy,
    ...a.area,
    inlSigmaLsb: a.analytic.inlSigmaLsb,
    dnlSigmaLsb: a.analytic.dnlSigmaLsb,
    ...yields(a, t, input),
    inlYieldAnalytic: a.analytic.inlYield,
    dnlYieldAnalytic: a.analytic.dnlYield,
    monotonicYieldAnalytic: a.analytic.monotonicYield,
    /** every criterion together, on the same footing as the three above */
    yieldAnalytic: a.analytic.yield,
    /** how the fast yields and the sizing were found: 'sampled' (the sizing sample) or 'closed-form' (an estimate) */
    fastYieldModel: c.fast.model,
    fastYieldTrials: c.fast.trials,
    sizingFeasible: c.fast.feasible,
    switchHandling: c.design?.chosen.handling ?? null,
    switchScale: c.design?.chosen.scale ?? null,
    systematicInlLsb: a.systematic.inlLsb,
    systematicDnlLsb: a.systematic.dnlLsb,
    loadedInlLsb: a.systematic.loadedInlLsb,
    glitchWorstVs: g.glitchWorstVs,
    glitchWorstFromCode: g.glitchWorstFromCode,
    glitchWorstToCode: g.glitchWorstToCode,
    glitchMajorCarryVs: g.glitchMajorCarryVs,
    irefMinA: r.irefMinA,
    irefMaxA: r.irefMaxA,
    rinMinOhm: finiteOrNull(r.rinMinOhm),
    rinMaxOhm: finiteOrNull(r.rinMaxOhm),
    refLoadCodeDependent: r.refLoadCodeDependent,
    refSourceMaxOhm: finiteOrNull(r.refSourceMaxOhm),
    refInlAtSourceLsb: r.refInlAtSourceLsb,
    bufferNeeded: r.bufferNeeded,
    routMinOhm: a.output.routMinOhm,
    routMaxOhm: a.output.routMaxOhm,
    tauS: a.output.tauS,
    settlingS: a.output.settlingS,
    maxUpdateRateHz: finiteOrNull(a.output.maxUpdateRateHz),
    noiseVrms: a.noise.noiseVrms,
    noiseKtcVrms: a.noise.noiseKtcVrms,
    quantNoiseVrms: a.noise.quantNoiseVrms,
    refPowerMaxW: r.refPowerMaxW,
    refPowerMeanW: r.refPowerMeanW
  }
}

type Metrics = ReturnType<typeof candidateMetrics>

/**
 * Units are sized to meet the yield target exactly, so an analytic yield lands on the target up
 * to floating-point rounding (0.99699999… for 0.997); that is a pass, not a failure.
 */
const YIELD_ROUNDING = 1e-9

/**
 * Where a Monte Carlo yield stands against the target, judged on its confidence interval: 'fails'
 * when the whole interval lies below the target, 'unsettled' when the target lies inside it (more
 * trials would settle it), 'meets' otherwise. A fast (analytic) yield has no interval: it is
 * judged on its value.
 */
export type YieldVerdict = 'meets' | 'fails' | 'unsettled'

/** The verdicts of the overall and the monotonic yield (Wilson intervals of the tally's counts). */
export function yieldVerdicts(t: McTally | null, input: EvaluateInput, m: Metrics): { yield: YieldVerdict, monotonic: YieldVerdict } {
  const target = input.spec.yieldTarget - YIELD_ROUNDING
  const judge = (passes: number, point: number): YieldVerdict => {
    if (!t || t.trials <= 0) return point < target ? 'fails' : 'meets'
    const ci = wilsonInterval(passes, t.trials, input.options.confidence)
    return ci.high < target ? 'fails' : ci.low < target ? 'unsettled' : 'meets'
  }
  return {
    yield: judge(t?.allPass ?? 0, m.yield),
    monotonic: input.spec.monotonicRequired ? judge(t?.monoPass ?? 0, m.monotonicYield) : 'meets'
  }
}

/** Spec items a candidate fails: area, yield, monotonic, update-rate, glitch, power, reference. */
export function failingItems(m: Metrics, input: EvaluateInput, verdicts: ReturnType<typeof yieldVerdicts>): string[] {
  const s = input.spec
  const checks: [string, boolean][] = [
    ['area', m.totalAreaMm2 > s.areaBudgetMm2],
    ['yield', verdicts.yield === 'fails'],
    ['monotonic', verdicts.monotonic === 'fails'],
    ['update-rate', m.maxUpdateRateHz !== null && m.maxUpdateRateHz < s.updateRateHz],
    ['glitch', m.glitchWorstVs > s.glitchLimitVs],
    ['power', m.refPowerMaxW > s.powerBudgetW],
    ['reference', s.refSourceOhm > 0 && m.bufferNeeded]
  ]
  return checks.filter(([, fails]) => fails).map(([name]) => name)
}

/** One output candidate. */
export function buildCandidate(c: CandidateContext, a: AnalyticCandidate, t: McTally | null, input: EvaluateInput) {
  const metrics = candidateMetrics(c, a, t, input)
  const verdicts = yieldVerdicts(t, input, metrics)
  const failing = failingItems(metrics, input, verdicts)
  const unsettled = (['yield', 'monotonic'] as const).filter(k => verdicts[k] === 'unsettled')
  return {
    id: c.shape.id,
    topology: c.shape.topology,
    unaryBits: c.shape.unaryBits,
    coarseBits: c.shape.coarseBits,
    decode: c.shape.decode,
    buffered: c.shape.buffered,
    metrics,
    meetsSpec: failing.length === 0,
    failing,
    /** yield items whose Monte Carlo interval contains the target: neither met nor failed until more trials run */
    unsettled: [...unsettled],
    linearity: linearitySection(a, t, input),
    /** the switch design the engine chose (or was given) and the best of each other handling */
    design: c.design ? { choice: c.design.choice, ...c.design.chosen, corner: c.design.corner, alternatives: c.design.alternatives } : null,
    glitch: { ...a.glitch },
    reference: { ...a.reference, irefA: a.series.irefA, rinOhm: a.series.rinOhm },
    output: { ...a.output, routOhm: a.series.routOhm, noise: a.noise }
  }
}
