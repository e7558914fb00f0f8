/**
 * Facts of one candidate for the rules: the spec, the process, the candidate's shape, its metrics
 * and quantities derived from them (ratios to the targets, binary bits, I-V noise gain, …), so a
 * rule compares a fact with a constant instead of doing arithmetic.
 */
import type { EvaluateCandidate, EvaluateInput } from '../core/contract/evaluate'

export type FactValues = Record<string, unknown>
export interface CandidateFacts {
  spec: FactValues
  process: FactValues
  candidate: FactValues
  metrics: FactValues
  derived: FactValues
}

const n = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null)
const ratio = (a: number | null, b: number | null): number | null => (a === null || b === null || b === 0 ? null : a / b)

function binaryBits(c: EvaluateCandidate, bits: number): number {
  if (c.topology === 'r2r-voltage' || c.topology === 'r2r-current') return bits
  if (c.topology === 'segmented') return bits - (c.unaryBits ?? 0)
  return 0
}

/** Smallest number of unary MSBs among segmented candidates that meet the DNL yield and glitch limit. */
export function smallestUnaryForDnlGlitch(candidates: readonly EvaluateCandidate[], input: EvaluateInput): number | null {
  const ok = candidates.filter(c => c.topology === 'segmented' && c.unaryBits !== null
    && (n(c.metrics.dnlYield) ?? 0) >= input.spec.yieldTarget && (n(c.metrics.glitchWorstVs) ?? Infinity) <= input.spec.glitchLimitVs)
  return ok.length ? Math.min(...ok.map(c => c.unaryBits!)) : null
}

/**
 * The most negative step of the nominal circuit (signed DNL, LSB): the minimum of the engine's own
 * per-code DNL series (`linearity.perCode.dnlLsb`, min/max-decimated, so every code's minimum is kept).
 * ≤ −1 means the nominal transfer falls or stalls at that step, whatever the mismatch.
 */
export function nominalDnlMinLsb(c: EvaluateCandidate): number | null {
  const perCode = (c.linearity as { perCode?: { dnlLsb?: { min?: readonly (number | null)[] } } }).perCode
  const mins = (perCode?.dnlLsb?.min ?? []).filter((v): v is number => typeof v === 'number' && Number.isFinite(v))
  return mins.length ? Math.min(...mins) : null
}

/** Current-mode I-V amplifier noise gain 1 + R_fb/R_out(code) over the codes (R_fb = R, handbook §2.3). */
function noiseGain(c: EvaluateCandidate, m: FactValues) {
  if (c.topology !== 'r2r-current') return { noiseGainMin: null, noiseGainMax: null, noiseGainSpan: null }
  const rfb = n(m.unitOhm)
  const min = rfb === null || n(m.routMaxOhm) === null ? null : 1 + rfb / n(m.routMaxOhm)!
  const max = rfb === null || n(m.routMinOhm) === null ? null : 1 + rfb / n(m.routMinOhm)!
  return { noiseGainMin: min, noiseGainMax: max, noiseGainSpan: ratio(max, min) }
}

function derived(c: EvaluateCandidate, input: EvaluateInput, smallestUnary: number | null): FactValues {
  const s = input.spec
  const m = c.metrics as FactValues
  const rl = s.loadResistanceOhm
  const rout = n(m.routMaxOhm)
  const shortfall = (y: unknown) => (n(y) === null ? null : Math.max(0, s.yieldTarget - n(y)!))
  return {
    binaryBits: binaryBits(c, s.bits),
    lsbV: s.vrefV / 2 ** s.bits,
    elementCount: (n(m.resistorCount) ?? 0) + (n(m.switchCount) ?? 0),
    areaToBudget: ratio(n(m.totalAreaMm2), s.areaBudgetMm2),
    resistorAreaToBudget: ratio(n(m.resistorAreaMm2), s.areaBudgetMm2),
    matchingLimited: m.sizingLimitedBy === 'inl' || m.sizingLimitedBy === 'dnl',
    glitchToLimit: ratio(n(m.glitchWorstVs), s.glitchLimitVs),
    majorCarryToLimit: ratio(n(m.glitchMajorCarryVs), s.glitchLimitVs),
    updateRateRatio: ratio(n(m.maxUpdateRateHz), s.updateRateHz),
    refPowerToBudget: ratio(n(m.refPowerMaxW), s.powerBudgetW),
    refSourceToMax: ratio(s.refSourceOhm, n(m.refSourceMaxOhm)),
    inlYieldShortfall: shortfall(m.inlYield),
    dnlYieldShortfall: shortfall(m.dnlYield),
    monotonicShortfall: shortfall(m.monotonicYield),
    dnlWorstCaseLsb: n(m.dnlSigmaLsb) === null ? null : 3 * n(m.dnlSigmaLsb)! + Math.abs(n(m.systematicDnlLsb) ?? 0),
    systematicDnlMinLsb: nominalDnlMinLsb(c),
    systematicDnlToTarget: ratio(Math.abs(n(m.systematicDnlLsb) ?? 0), s.dnlTargetLsb),
    loadGainErrorLsb: rl === null || rout === null || c.topology === 'r2r-current' ? null : (rout / (rout + rl)) * 2 ** s.bits,
    ...noiseGain(c, m),
    smallestUnaryForDnlGlitch: smallestUnary,
    isSmallestUnaryForDnlGlitch: c.topology === 'segmented' && smallestUnary !== null && c.unaryBits === smallestUnary
  }
}

/** The facts of every candidate of an evaluation, in candidate order. */
export function candidateFacts(input: EvaluateInput, candidates: readonly EvaluateCandidate[]): CandidateFacts[] {
  const smallest = smallestUnaryForDnlGlitch(candidates, input)
  return candidates.map(c => ({
    spec: { ...input.spec },
    process: { ...input.process },
    candidate: { id: c.id, topology: c.topology, unaryBits: c.unaryBits, coarseBits: c.coarseBits ?? null, decode: c.decode ?? null, buffered: c.buffered ?? null },
    metrics: { ...c.metrics },
    derived: derived(c, input, smallest)
  }))
}
