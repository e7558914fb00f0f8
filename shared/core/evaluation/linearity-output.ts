/**
 * The linearity section of a candidate: analytic σ and yields, systematic (nominal) INL/DNL,
 * and the Monte Carlo distributions with Wilson confidence intervals, worst codes and the
 * decimated per-code INL envelope.
 */
import type { EvaluateInput } from '../contract/evaluate'
import type { McTally } from '../stats/accumulator'
import { HIST_BINS, HIST_SPAN } from '../stats/accumulator'
import type { YieldEstimate } from '../stats/interval'
import { wilsonInterval } from '../stats/interval'
import type { AnalyticCandidate } from './analytic'

function moments(sum: number, sumSq: number, n: number): { meanLsb: number, sdLsb: number } {
  const mean = sum / n
  return { meanLsb: mean, sdLsb: n > 1 ? Math.sqrt(Math.max(0, (sumSq - n * mean * mean) / (n - 1))) : 0 }
}

function bucketCodes(count: number, bits: number): number[] {
  const size = 2 ** bits / count
  return Array.from({ length: count }, (_, b) => b * size)
}

/** Monte Carlo summary of one candidate, or null without trials. */
export function monteCarloSection(t: McTally | null, input: EvaluateInput) {
  if (!t || t.trials === 0) {
    return null
  }
  const { spec, options } = input
  const ci = (passes: number): YieldEstimate => wilsonInterval(passes, t.trials, options.confidence)
  const codes = bucketCodes(t.worstCodeHist.length, spec.bits)
  return {
    trials: t.trials,
    seed: options.seed,
    confidence: options.confidence,
    inl: {
      ...ci(t.inlPass),
      ...moments(t.inlSum, t.inlSumSq, t.trials),
      worstLsb: t.worstInlLsb,
      worstCode: t.worstInlCode,
      histogram: { binWidthLsb: (HIST_SPAN * spec.inlTargetLsb) / HIST_BINS, counts: t.inlHist }
    },
    dnl: {
      ...ci(t.dnlPass),
      ...moments(t.dnlSum, t.dnlSumSq, t.trials),
      worstLsb: t.worstDnlLsb,
      worstCode: t.worstDnlCode,
      histogram: { binWidthLsb: (HIST_SPAN * spec.dnlTargetLsb) / HIST_BINS, counts: t.dnlHist }
    },
    monotonic: ci(t.monoPass),
    all: ci(t.allPass),
    worstInlCodes: { codes, counts: t.worstCodeHist },
    envelope: { codes, inlMinLsb: t.envelopeMin, inlMaxLsb: t.envelopeMax, trials: t.envelopeTrials }
  }
}

/** The linearity section (analytic, systematic and Monte Carlo, and the per-code and per-area chart series). */
export function linearitySection(a: AnalyticCandidate, t: McTally | null, input: EvaluateInput) {
  return {
    definition: input.options.inlDefinition,
    analytic: a.analytic,
    systematic: a.systematic,
    monteCarlo: monteCarloSection(t, input),
    perCode: a.perCode,
    dnlEnvelope: a.dnlEnvelope ?? null,
    yieldAgainstArea: a.yieldAgainstArea ?? null
  }
}
