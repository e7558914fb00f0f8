/**
 * Monte Carlo samplers: one trial of a candidate from a shared buffer of standard normals z.
 * Element values are relative to the unit R (R = 1): a unit is 1 + σ_u z, a 2R element
 * 2(1 + σ_2R z) with σ_2R = σ_u/√2 (two units in series) or σ_u (one unit-area element).
 * Every sampler reads z from index 0: candidates in one trial share their random numbers
 * (common random numbers), see stats/montecarlo.ts.
 */
import { ladderRoutOhm, ladderWeights } from '../solve/ladder'
import type { Envelope } from '../stats/envelope'
import { envelopeFromBinary } from '../stats/envelope'
import type { InlDefinition, LinearityResult } from '../stats/linearity'
import { binaryLine, linearityFromBinaryWeights } from '../stats/linearity'
import { createSegmentedScratch, linearityFromSegmentedWeights } from '../stats/segmented'
import type { NormalsSummary } from '../stats/string-mc'
import { stringTrial } from '../stats/string-mc'
import { createTwoStageScratch, twoStageTrial } from '../stats/two-stage'
import { kernelsFor } from '../stats/wasm-kernels'
import type { CandidateShape, TwoRConstruction } from './shapes'
import type { LadderDesignValues } from './switch-design'
import { coarseToFineRatio, lowBits } from './shapes'

/** One candidate's trial: reads z[0 … normals), writes its INL/DNL extremes (and envelope). */
export interface TrialSampler {
  /** equal keys give identical results from the same z (computed once per trial) */
  key: string
  normals: number
  /** set when `run` can use the sum and first extremes of z[0 … summedPrefix) (the driver passes them as `zs`) */
  summedPrefix?: number
  run: (z: Float64Array, out: LinearityResult, env?: Envelope, zs?: NormalsSummary) => void
}

/**
 * Sampling parameters of one candidate. `switchRatio` = R_on / R_unit (strings and two-stage
 * strings: the tap and selection switches); `offsetSigma` = σ_os / V_REF; `design` the ladder's or
 * segmented DAC's element values with its switches at the analysed corner (switch-design.ts);
 * `switchSigma` the relative σ of one process switch's R_on (falls as 1/√width).
 */
export interface SamplerParams {
  sigmaUnit: number
  switchRatio: number
  twoR: TwoRConstruction
  offsetSigma: number
  def: InlDefinition
  design?: LadderDesignValues | null
  switchSigma?: number
}

/** Nominal total and σ (relative to R) of each leg: resistor plus switch, errors in quadrature. */
interface LegStats { nominal: Float64Array, sigma: Float64Array }

function legStats(res: ArrayLike<number>, sw: ArrayLike<number>, widths: ArrayLike<number>, resSigma: number, swSigma: number): LegStats {
  const n = res.length
  const nominal = new Float64Array(n)
  const sigma = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    const s = sw[i]! * swSigma / Math.sqrt(widths[i]!)
    nominal[i] = res[i]! + sw[i]!
    sigma[i] = Math.sqrt(resSigma * resSigma + s * s)
  }
  return { nominal, sigma }
}

/** The ladder section's sampled values: legs, series arms and termination (relative to R). */
interface LadderParts { legs: LegStats, series: Float64Array, termNominal: number, termSigma: number }

function ladderParts(v: LadderDesignValues, s2: number, p: SamplerParams): LadderParts {
  const swSigma = p.switchSigma ?? 0
  const legs = legStats(v.legs, v.legSwitch, v.legWidths, 2 * s2, swSigma)
  const ts = v.terminationSwitch * swSigma / Math.sqrt(v.unaryWidth)
  return { legs, series: v.series, termNominal: v.termination + v.terminationSwitch, termSigma: Math.sqrt(4 * s2 * s2 + ts * ts) }
}

/** Draws the ladder section from z[from …]: legs, then series arms, then the termination. */
function drawLadder(x: LadderParts, sigmaUnit: number, z: Float64Array, from: number, legs: Float64Array, series: Float64Array): number {
  const n = legs.length
  for (let i = 0; i < n; i++) legs[i] = x.legs.nominal[i]! + x.legs.sigma[i]! * z[from + i]!
  for (let i = 0; i < n - 1; i++) series[i] = x.series[i]! * (1 + sigmaUnit * z[from + n + i]!)
  return x.termNominal + x.termSigma * z[from + 2 * n - 1]!
}

/** A short text naming the design values (sampler keys: equal keys must give equal trials). */
function designKey(v: LadderDesignValues | null | undefined, p: SamplerParams): string {
  if (!v) return `sw${p.switchRatio}`
  return [v.legs, v.legSwitch, v.series, v.legWidths].map(a => Array.from(a).join(',')).join('|')
    + `|${v.termination},${v.terminationSwitch},${v.unary},${v.unarySwitch},${v.joint},${v.unaryWidth},${p.switchSigma ?? 0}`
}

/** The design values a ladder or segmented sampler needs: the given ones, else plain legs with `switchRatio`. */
function designOf(bits: number, unaryBits: number, p: SamplerParams): LadderDesignValues {
  if (p.design) return p.design
  const l = bits - unaryBits
  return {
    legs: new Float64Array(l).fill(2),
    legSwitch: new Float64Array(l).fill(p.switchRatio),
    series: new Float64Array(Math.max(0, l - 1)).fill(1),
    termination: 2,
    terminationSwitch: 0,
    unary: 2,
    unarySwitch: p.switchRatio,
    joint: 1,
    legWidths: new Float64Array(l).fill(1),
    unaryWidth: 1
  }
}

function fillScaled(dst: Float64Array, z: Float64Array, from: number, nominal: number, sigma: number): void {
  for (let i = 0; i < dst.length; i++) {
    dst[i] = nominal * (1 + sigma * z[from + i]!)
  }
}

function ladderSampler(bits: number, p: SamplerParams): TrialSampler {
  const s2 = p.twoR === 'two-units' ? p.sigmaUnit * Math.SQRT1_2 : p.sigmaUnit
  const v = designOf(bits, 0, p)
  const parts = ladderParts(v, s2, p)
  const legs = new Float64Array(bits)
  const series = new Float64Array(bits - 1)
  const w = new Float64Array(bits)
  const d = new Float64Array(bits)
  const scratch = new Float64Array(256)
  return {
    key: `ladder:${bits}:${p.sigmaUnit}:${p.twoR}:${p.def}:${designKey(p.design, p)}`,
    normals: 2 * bits,
    run(z, out, env) {
      const term = drawLadder(parts, p.sigmaUnit, z, 0, legs, series)
      ladderWeights(legs, series, term, 0, w)
      linearityFromBinaryWeights(w, 0, p.def, out)
      if (env) {
        const { a, s } = binaryLine(w, 0, p.def)
        for (let i = 0; i < bits; i++) {
          d[i] = w[i]! / s - (1 << (bits - 1 - i))
        }
        envelopeFromBinary(env, -a / s, d, scratch)
      }
    }
  }
}

/**
 * Leg conductances of the segmented trial in progress. One buffer for every segmented sampler of
 * the thread (a trial runs them one after another and each fills it before reading it): the
 * sweep M = 1 … 15 then keeps 2^15 values in cache instead of 2^16 spread over 15 arrays, so
 * the shared normals stay cached too. Single-threaded by construction (a worker has its own).
 */
let sharedLegs = new Float64Array(0)

/** A view of `count` entries of the shared buffer; `view` is returned again while still valid. */
function legBuffer(count: number, view?: Float64Array): Float64Array {
  if (view && view.buffer === sharedLegs.buffer) {
    return view
  }
  if (sharedLegs.length < count) {
    sharedLegs = new Float64Array(count)
  }
  return sharedLegs.subarray(0, count)
}

/**
 * g_j = 1/(2 + b·z_j + sw) (in this order: the rounding is part of the recorded results) for
 * every leg into `g`; returns Σg and writes the positions of the first largest and first smallest
 * g into `ext` (new records of iid values are rare: cheap branches).
 */
function sampleLegs(g: Float64Array, z: Float64Array, b: number, sw: number, ext: { hi: number, lo: number }): number {
  let sum = 0
  let hiV = -Infinity
  let loV = Infinity
  for (let j = 0; j < g.length; j++) {
    const gj = 1 / (2 + b * z[j]! + sw)
    g[j] = gj
    sum += gj
    if (gj > hiV) {
      hiV = gj
      ext.hi = j
    }
    if (gj < loV) {
      loV = gj
      ext.lo = j
    }
  }
  return sum
}

/**
 * Unary legs all meet at the output node, so their weights are u_j = x_out·g_j with
 * g_j = 1/(R_j + R_on) and x_out = 1/(Σg + 1/(R_joint + R_ladder)); the binary weights are the
 * plain ladder's scaled by x_out/(R_joint + R_ladder). This is `segmentedWeights` (solve/ladder.ts)
 * fused with the sampling into one division per leg; a test checks the two agree.
 */
function segmentedSampler(m: number, l: number, p: SamplerParams): TrialSampler {
  const s2 = p.twoR === 'two-units' ? p.sigmaUnit * Math.SQRT1_2 : p.sigmaUnit
  const v = designOf(m + l, m, p)
  const parts = ladderParts(v, s2, p)
  const us = v.unarySwitch * (p.switchSigma ?? 0) / Math.sqrt(v.unaryWidth)
  // a unary leg is 2 + b·z + sw (relative to R): resistor and switch errors in quadrature
  const b = Math.sqrt(4 * s2 * s2 + us * us)
  const sw = v.unary + v.unarySwitch - 2
  const legCount = (1 << m) - 1
  const legs = new Float64Array(l)
  const series = new Float64Array(Math.max(0, l - 1))
  const binary = new Float64Array(l)
  const scratch = createSegmentedScratch(m, 256)
  const at = legCount
  let g = legBuffer(legCount)
  const extremes = { hi: 0, lo: 0 }
  return {
    key: `segmented:${m}:${l}:${p.sigmaUnit}:${p.twoR}:${p.def}:${designKey(p.design, p)}`,
    normals: at + 2 * l + 1,
    run(z, out, env) {
      const k = kernelsFor(z)
      let sumG: number
      if (k && at <= k.legs.length) {
        // The same pass in WebAssembly, into its leg buffer (which its unary scan then reads).
        g = k.legs.subarray(0, at)
        sumG = k.sampleLegs(at, b, sw)
        extremes.hi = k.legHiIndex()
        extremes.lo = k.legLoIndex()
      } else {
        g = legBuffer(at, g)
        sumG = sampleLegs(g, z, b, sw, extremes)
      }
      const joint = v.joint * (1 + p.sigmaUnit * z[at]!)
      const term = drawLadder(parts, p.sigmaUnit, z, at + 1, legs, series)
      const toLadder = joint + ladderRoutOhm(legs, series, term, 0)
      const xOut = 1 / (sumG + 1 / toLadder)
      ladderWeights(legs, series, term, 0, binary)
      for (let i = 0; i < l; i++) {
        binary[i] = binary[i]! * (xOut / toLadder)
      }
      linearityFromSegmentedWeights(g, binary, 0, p.def, out, scratch, env, xOut, xOut * sumG, extremes)
    }
  }
}

function twoStageSampler(s: CandidateShape, p: SamplerParams): TrialSampler {
  const m = s.coarseBits ?? 1
  const l = lowBits(s)
  const coarse = new Float64Array((1 << m))
  const fine = new Float64Array((1 << l))
  const scratch = createTwoStageScratch(m, l)
  const ratio = coarseToFineRatio(s)
  const buffered = s.buffered === true
  // the selection switches load the fine string only when it hangs on the coarse string
  const sample = { coarse, fine, buffered, offsetLo: 0, offsetHi: 0, switchRel: buffered ? 0 : p.switchRatio }
  return {
    key: `two-stage:${m}:${l}:${buffered}:${p.sigmaUnit}:${p.offsetSigma}:${p.def}:${sample.switchRel}`,
    normals: coarse.length + fine.length + 2,
    run(z, out, env) {
      fillScaled(coarse, z, 0, ratio, p.sigmaUnit)
      fillScaled(fine, z, coarse.length, 1, p.sigmaUnit)
      const o = coarse.length + fine.length
      sample.offsetLo = buffered ? p.offsetSigma * z[o]! : 0
      sample.offsetHi = buffered ? p.offsetSigma * z[o + 1]! : 0
      twoStageTrial(sample, p.def, out, scratch, env)
    }
  }
}

/** The sampler of a candidate; strings and R-2R variants with equal parameters share a key. */
export function createSampler(s: CandidateShape, p: SamplerParams): TrialSampler {
  switch (s.topology) {
    case 'string':
      return {
        key: `string:${s.bits}:${p.sigmaUnit}:${p.def}`,
        normals: (1 << s.bits),
        summedPrefix: p.def === 'endpoint' ? (1 << s.bits) - 1 : undefined,
        run: (z, out, env, zs) => {
          stringTrial(z, (1 << s.bits), p.sigmaUnit, p.def, out, env, zs)
        }
      }
    case 'r2r-voltage':
    case 'r2r-current':
      return ladderSampler(s.bits, p)
    case 'segmented':
      return segmentedSampler(s.unaryBits ?? 1, lowBits(s), p)
    case 'two-stage-string':
      return twoStageSampler(s, p)
  }
}
