/**
 * Mergeable Monte Carlo tallies of one candidate: pass counts (INL, DNL, monotonic, all), moments
 * and fixed-bin histograms of max|INL| and max|DNL|, the worst trial, where the worst INL code
 * falls, and the per-bucket INL envelope. Plain arrays only, so parts cross worker boundaries;
 * `mergeTally` is associative, so fixed chunking gives one result for any number of workers.
 */
import type { Envelope } from './envelope'
import type { LinearityResult } from './linearity'
import { dnlAbsLsb, inlAbsLsb } from './linearity'

/** Histogram bins over [0, HIST_SPAN × target); one extra overflow bin. */
export const HIST_BINS = 40
export const HIST_SPAN = 4

/** Serialisable tallies (LSB for INL/DNL). */
export interface McTally {
  trials: number
  inlPass: number
  dnlPass: number
  monoPass: number
  allPass: number
  inlSum: number
  inlSumSq: number
  dnlSum: number
  dnlSumSq: number
  worstInlLsb: number
  worstInlCode: number
  worstDnlLsb: number
  worstDnlCode: number
  inlHist: number[]
  dnlHist: number[]
  worstCodeHist: number[]
  envelopeMin: number[]
  envelopeMax: number[]
  /** trials behind envelopeMin/Max (those of the chunks that widened it) */
  envelopeTrials: number
}

/** An empty tally whose worst-code histogram and envelope have `buckets` entries. */
export function createTally(buckets: number): McTally {
  return {
    trials: 0, inlPass: 0, dnlPass: 0, monoPass: 0, allPass: 0,
    inlSum: 0, inlSumSq: 0, dnlSum: 0, dnlSumSq: 0,
    worstInlLsb: 0, worstInlCode: 0, worstDnlLsb: 0, worstDnlCode: 0,
    inlHist: new Array<number>(HIST_BINS + 1).fill(0),
    dnlHist: new Array<number>(HIST_BINS + 1).fill(0),
    worstCodeHist: new Array<number>(buckets).fill(0),
    envelopeMin: new Array<number>(buckets).fill(Infinity),
    envelopeMax: new Array<number>(buckets).fill(-Infinity),
    envelopeTrials: 0
  }
}

/** Pass criteria of one trial (LSB). */
export interface TallyTargets {
  inlTargetLsb: number
  dnlTargetLsb: number
  monotonicRequired: boolean
}

function bin(value: number, target: number): number {
  return Math.min(HIST_BINS, Math.floor((value / (HIST_SPAN * target)) * HIST_BINS))
}

/** Adds one trial's result to the tally. `shift` maps a code to its envelope bucket. */
export function addTrial(t: McTally, r: LinearityResult, targets: TallyTargets, shift: number): void {
  const inl = inlAbsLsb(r)
  const dnl = dnlAbsLsb(r)
  const inlOk = inl <= targets.inlTargetLsb
  const dnlOk = dnl <= targets.dnlTargetLsb
  const mono = r.dnlMinLsb >= -1
  t.trials++
  t.inlPass += inlOk ? 1 : 0
  t.dnlPass += dnlOk ? 1 : 0
  t.monoPass += mono ? 1 : 0
  t.allPass += inlOk && dnlOk && (mono || !targets.monotonicRequired) ? 1 : 0
  t.inlSum += inl
  t.inlSumSq += inl * inl
  t.dnlSum += dnl
  t.dnlSumSq += dnl * dnl
  const inlCode = r.inlMaxLsb >= -r.inlMinLsb ? r.inlMaxCode : r.inlMinCode
  if (inl > t.worstInlLsb) {
    t.worstInlLsb = inl
    t.worstInlCode = inlCode
  }
  if (dnl > t.worstDnlLsb) {
    t.worstDnlLsb = dnl
    t.worstDnlCode = r.dnlMaxLsb >= -r.dnlMinLsb ? r.dnlMaxCode : r.dnlMinCode
  }
  t.inlHist[bin(inl, targets.inlTargetLsb)]!++
  t.dnlHist[bin(dnl, targets.dnlTargetLsb)]!++
  t.worstCodeHist[inlCode >> shift]!++
}

/** Copies an envelope's buckets, widened over `trials` trials, into the tally (after a chunk). */
export function absorbEnvelope(t: McTally, env: Envelope, trials: number): void {
  t.envelopeTrials += trials
  for (let b = 0; b < env.min.length; b++) {
    t.envelopeMin[b] = Math.min(t.envelopeMin[b]!, env.min[b]!)
    t.envelopeMax[b] = Math.max(t.envelopeMax[b]!, env.max[b]!)
  }
}

/** Merges `b` into `a` (same bucket count); associative and commutative up to the worst-code tie rule. */
export function mergeTally(a: McTally, b: McTally): McTally {
  const sum = (x: number[], y: number[]) => x.map((v, i) => v + y[i]!)
  const worstInl = b.worstInlLsb > a.worstInlLsb ? b : a
  const worstDnl = b.worstDnlLsb > a.worstDnlLsb ? b : a
  return {
    trials: a.trials + b.trials,
    inlPass: a.inlPass + b.inlPass,
    dnlPass: a.dnlPass + b.dnlPass,
    monoPass: a.monoPass + b.monoPass,
    allPass: a.allPass + b.allPass,
    inlSum: a.inlSum + b.inlSum,
    inlSumSq: a.inlSumSq + b.inlSumSq,
    dnlSum: a.dnlSum + b.dnlSum,
    dnlSumSq: a.dnlSumSq + b.dnlSumSq,
    worstInlLsb: worstInl.worstInlLsb,
    worstInlCode: worstInl.worstInlCode,
    worstDnlLsb: worstDnl.worstDnlLsb,
    worstDnlCode: worstDnl.worstDnlCode,
    inlHist: sum(a.inlHist, b.inlHist),
    dnlHist: sum(a.dnlHist, b.dnlHist),
    worstCodeHist: sum(a.worstCodeHist, b.worstCodeHist),
    ...mergedEnvelope(a, b)
  }
}

/** The envelope of two tallies; a chunk that kept none sends empty arrays, so the other's is the envelope. */
function mergedEnvelope(a: McTally, b: McTally): Pick<McTally, 'envelopeMin' | 'envelopeMax' | 'envelopeTrials'> {
  const envelopeTrials = a.envelopeTrials + b.envelopeTrials
  if (b.envelopeTrials === 0) return { envelopeMin: a.envelopeMin, envelopeMax: a.envelopeMax, envelopeTrials }
  if (a.envelopeTrials === 0) return { envelopeMin: b.envelopeMin, envelopeMax: b.envelopeMax, envelopeTrials }
  return {
    envelopeMin: a.envelopeMin.map((v, i) => Math.min(v, b.envelopeMin[i]!)),
    envelopeMax: a.envelopeMax.map((v, i) => Math.max(v, b.envelopeMax[i]!)),
    envelopeTrials
  }
}
