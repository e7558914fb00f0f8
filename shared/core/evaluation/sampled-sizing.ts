/**
 * Sampled sizing and fast yields (handbook §4.9): the unit σ that meets the yield target, and the
 * yields at the drawn σ, from a fixed sample of sizingTrials(…) circuits solved exactly by the
 * candidate's own Monte Carlo sampler, so every deterministic error the engine models (switch
 * on-resistance and its compensation residual at the worst switch corner, the two-stage loading)
 * sits in the same trials as the random mismatch.
 *
 * Per trial and criterion (max|INL| ≤ T_INL, max|DNL| ≤ T_DNL, DNL > −1), the error is
 * f(σ) = max_k |n_k + σ·g_k| to first order: convex in σ, f(0) the trial's error without resistor
 * mismatch. A chord through (0, f(0)) and (σ_s, f(σ_s)) gives the σ at which the trial stops
 * passing (its critical σ); it is exact at σ_s and, without a nominal error, at every σ. The σ
 * for yield Y is the (1 − Y) quantile of the critical σ's; where fewer than TAIL_COUNT trials fail,
 * a Gaussian tail log P = α − β/σ² fitted through the 2.5 % and TAIL_COUNT/K points extends it.
 * Candidates with a nominal error are sampled again at the σ found (the chord is then exact
 * there), at most REFINE_PASSES times. Each candidate draws its own sample (seeded by its stream
 * name), so its area does not depend on the other candidates or on the Monte Carlo seed.
 */
import type { TrialSampler } from '../models/samplers'
import { visitTrials } from '../stats/montecarlo'
import type { LinearityResult } from '../stats/linearity'
import { dnlAbsLsb, inlAbsLsb, newLinearityResult } from '../stats/linearity'
import { deriveSeed } from '../stats/seed'

/**
 * Circuits in a candidate's sizing sample: 4,000 where a trial is cheap (ladders, small unary
 * arrays), fewer for large arrays (at least 1,000), a fixed function of the sampler's size, so an
 * area is reproducible. `cost` is normals per trial times a topology's relative cost per normal.
 */
export function sizingTrials(cost: number): number {
  return Math.max(1000, Math.min(4000, Math.floor(2 ** 21 / cost / 250) * 250))
}
/** The sample's seed: fixed, so a candidate's area never depends on the Monte Carlo seed. */
export const SIZING_SEED = deriveSeed(0x52574953, 1)
/** Largest sampler (normals per trial) that is sized by sampling; larger arrays use closed forms. */
export const SAMPLED_MAX_NORMALS = 2 ** 11 + 64
/** σ_u of a pure candidate's one pass: its errors scale with σ_u, so any σ serves every target. */
const PURE_SIGMA = 1e-4
const TAIL_COUNT = 5
const REFINE_PASSES = 2
/** Critical σ recorded for a trial whose chord never rises (its error fell with mismatch), as a multiple of the sampled σ. */
const CRIT_CAP = 64

/** Targets of a trial. */
export interface SampledTargets { inlTargetLsb: number, dnlTargetLsb: number, monotonicRequired: boolean, yieldTarget: number }

/** Critical σ's of one candidate's sample, per criterion and for all together. */
export interface CriticalSigmas { inl: Float64Array, dnl: Float64Array, mono: Float64Array, all: Float64Array }

/** Fast yields at one σ (fractions). */
export interface FastYields { inlYield: number, dnlYield: number, monotonicYield: number, yield: number }

/** What the sample gave one candidate. */
export interface SampledSizing {
  trials: number
  /** σ_u meeting the target for INL alone, DNL alone, and every criterion together; 0 when none does */
  sigmaForInl: number
  sigmaForDnl: number
  sigmaForAll: number
  crit: CriticalSigmas
}

/** One candidate to size: a sampler factory (σ_u → sampler) and where to start. */
export interface SizingJob {
  /** names the sample: jobs with equal streams draw the same circuits (and must be the same circuit) */
  stream: string
  sampler: (sigmaUnit: number) => TrialSampler
  startSigma: number
  /** no nominal error and no switch mismatch: f(0) = 0 and the chord is exact everywhere */
  pure: boolean
  /** errors that stay random without resistor mismatch (switch mismatch, buffer offsets): f(0) differs per circuit */
  randomAtZero: boolean
  /** circuits in the sample (sizingTrials) */
  trials: number
  /** sample again at the σ found (a nominal error large enough to bend the chord, ≥ 5 % of a target) */
  refine: boolean
}

interface Pass { inl: Float64Array, dnl: Float64Array, mono: Float64Array }

function newPass(k: number): Pass {
  return { inl: new Float64Array(k), dnl: new Float64Array(k), mono: new Float64Array(k) }
}

/** FNV-1a hash of a stream name (32 bits). */
function streamKey(name: string): number {
  let h = 0x811c9dc5
  for (let i = 0; i < name.length; i++) h = Math.imul(h ^ name.charCodeAt(i), 0x01000193) >>> 0
  return h
}

/**
 * One pass of a candidate's own fixed sample at its σ: the circuits depend on the candidate alone,
 * never on which other candidates are evaluated beside it.
 */
function samplePass(sampler: TrialSampler, stream: string, trials: number): Pass {
  const key = `${stream}|${trials}|${sampler.key}`
  const hit = passMemo.get(key)
  if (hit) return hit
  const p = newPass(trials)
  visitTrials(deriveSeed(SIZING_SEED, streamKey(stream)), trials, [sampler], (t, _j, r: LinearityResult) => {
    p.inl[t] = inlAbsLsb(r)
    p.dnl[t] = dnlAbsLsb(r)
    p.mono[t] = -r.dnlMinLsb
  })
  if (passMemo.size >= PASS_MEMO_LIMIT) passMemo.delete(passMemo.keys().next().value!)
  passMemo.set(key, p)
  return p
}

/** Passes already run in this thread, by stream and sampler (a pure candidate's pass serves any target). */
const passMemo = new Map<string, Pass>()
const PASS_MEMO_LIMIT = 256

/** The errors of `s` with every z set to zero: the nominal circuit (LSB; mono = −min DNL). */
export function nominalErrors(s: TrialSampler): { inl: number, dnl: number, mono: number } {
  const r = newLinearityResult()
  s.run(new Float64Array(s.normals), r)
  return { inl: inlAbsLsb(r), dnl: dnlAbsLsb(r), mono: -r.dnlMinLsb }
}

/** Critical σ of one trial from the chord through (0, f0) and (σs, f1). */
function chord(f0: number, f1: number, t: number, sigma: number): number {
  if (f1 <= t) return f1 <= f0 ? CRIT_CAP * sigma : sigma * (t - f0) / (f1 - f0)
  return f0 >= t ? 0 : sigma * (t - f0) / (f1 - f0)
}

function criticals(zero: Pass, at: Pass, sigma: number, g: SampledTargets): CriticalSigmas {
  const k = at.inl.length
  const c: CriticalSigmas = { inl: new Float64Array(k), dnl: new Float64Array(k), mono: new Float64Array(k), all: new Float64Array(k) }
  for (let t = 0; t < k; t++) {
    c.inl[t] = chord(zero.inl[t]!, at.inl[t]!, g.inlTargetLsb, sigma)
    c.dnl[t] = chord(zero.dnl[t]!, at.dnl[t]!, g.dnlTargetLsb, sigma)
    c.mono[t] = chord(zero.mono[t]!, at.mono[t]!, 1, sigma)
    c.all[t] = Math.min(c.inl[t]!, c.dnl[t]!, g.monotonicRequired ? c.mono[t]! : Infinity)
  }
  return c
}

/** Gaussian tail of the failing trials: P(crit < σ) ≈ exp(α − β/σ²), through the 2.5 % and TAIL_COUNT/K points (close to the tail, where one step dominates). */
function tailFit(sorted: Float64Array): { alpha: number, beta: number } | null {
  const k = sorted.length
  const s1 = 0.025
  const s2 = TAIL_COUNT / k
  const c1 = sorted[Math.floor(s1 * k) - 1]!
  const c2 = sorted[TAIL_COUNT - 1]!
  if (!(c2 > 0) || !(c1 > c2)) return null
  const u1 = 1 / (c1 * c1)
  const u2 = 1 / (c2 * c2)
  const beta = Math.log(s1 / s2) / (u2 - u1)
  return { alpha: Math.log(s1) + beta * u1, beta }
}

/** One-sided normal quantile of the sizing margin (99 %): the sample's yield must clear the target by this many standard errors. */
const MARGIN_Z = 2.326

/** Most failing trials of K whose Wilson lower bound (one-sided, MARGIN_Z) still reaches Y. */
function allowedFails(k: number, yieldTarget: number): number {
  const z2 = MARGIN_Z * MARGIN_Z
  for (let f = Math.floor((1 - yieldTarget) * k); f >= 0; f--) {
    const p = 1 - f / k
    const low = (p + z2 / (2 * k) - MARGIN_Z * Math.sqrt(p * (1 - p) / k + z2 / (4 * k * k))) / (1 + z2 / k)
    if (low >= yieldTarget) return f
  }
  return -1
}

/**
 * The largest σ at which the sample meets Y with margin: its pass fraction's one-sided 99 % Wilson
 * lower bound reaches Y, so a sizing on K circuits does not fall short of the target by chance.
 * Where that allows fewer than TAIL_COUNT failing trials, the fitted tail is read at 1 − Y.
 * 0 when no σ meets it (the circuit fails without mismatch).
 */
export function sigmaForYield(crit: Float64Array, yieldTarget: number): number {
  const { sorted, fit } = sortedCrit(crit)
  const fails = allowedFails(sorted.length, yieldTarget)
  if (fails >= TAIL_COUNT) return sorted[fails]!
  if (!fit) return sorted[Math.max(0, fails)]!
  // the same margin in the tail: read the fit at half the allowed failure rate
  const sigma = Math.sqrt(fit.beta / (fit.alpha - Math.log((1 - yieldTarget) / 2)))
  return Math.min(sigma, sorted[TAIL_COUNT - 1]!)
}

/** Sorted copy and tail fit of a critical-σ array, made once per array (the yield curve reads it 15 times). */
const sortedOf = new WeakMap<Float64Array, { sorted: Float64Array, fit: ReturnType<typeof tailFit> }>()

function sortedCrit(crit: Float64Array): { sorted: Float64Array, fit: ReturnType<typeof tailFit> } {
  let hit = sortedOf.get(crit)
  if (!hit) {
    const sorted = Float64Array.from(crit).sort()
    hit = { sorted, fit: tailFit(sorted) }
    sortedOf.set(crit, hit)
  }
  return hit
}

/** Number of sorted values below x (binary search). */
function countBelow(sorted: Float64Array, x: number): number {
  let lo = 0
  let hi = sorted.length
  while (lo < hi) {
    const mid = (lo + hi) >> 1
    if (sorted[mid]! < x) lo = mid + 1
    else hi = mid
  }
  return lo
}

/** The fraction of trials passing at σ, with the fitted tail where fewer than TAIL_COUNT fail. */
export function yieldAt(crit: Float64Array, sigma: number): number {
  const { sorted, fit } = sortedCrit(crit)
  const fails = countBelow(sorted, sigma)
  if (fails >= TAIL_COUNT || !fit) return 1 - fails / crit.length
  return 1 - Math.min(TAIL_COUNT / crit.length, Math.exp(fit.alpha - fit.beta / (sigma * sigma)))
}

/** Fast yields of a sized candidate at the σ it is drawn with. */
export function fastYields(crit: CriticalSigmas, sigma: number): FastYields {
  return { inlYield: yieldAt(crit.inl, sigma), dnlYield: yieldAt(crit.dnl, sigma), monotonicYield: yieldAt(crit.mono, sigma), yield: yieldAt(crit.all, sigma) }
}

function zeroPass(j: SizingJob): Pass {
  if (j.randomAtZero) return samplePass(j.sampler(0), j.stream, j.trials)
  const n = nominalErrors(j.sampler(0))
  const p = newPass(j.trials)
  p.inl.fill(n.inl)
  p.dnl.fill(n.dnl)
  p.mono.fill(n.mono)
  return p
}

/**
 * Sizes one candidate on its fixed sample: one pass at the starting σ, then up to REFINE_PASSES
 * more at the σ found when the candidate is not pure and the σ moved by more than 2 %.
 */
export function sampleSizing(j: SizingJob, g: SampledTargets): SampledSizing {
  const zero = zeroPass(j)
  let sigma = j.pure ? PURE_SIGMA : j.startSigma
  let crit = criticals(zero, samplePass(j.sampler(sigma), j.stream, j.trials), sigma, g)
  for (let pass = 0; pass < REFINE_PASSES && j.refine; pass++) {
    const next = sigmaForYield(crit.all, g.yieldTarget)
    if (!(next > 0) || Math.abs(next / sigma - 1) <= 0.02) break
    sigma = next
    crit = criticals(zero, samplePass(j.sampler(sigma), j.stream, j.trials), sigma, g)
  }
  return {
    trials: j.trials,
    sigmaForInl: sigmaForYield(crit.inl, g.yieldTarget),
    sigmaForDnl: sigmaForYield(crit.dnl, g.yieldTarget),
    sigmaForAll: sigmaForYield(crit.all, g.yieldTarget),
    crit
  }
}
