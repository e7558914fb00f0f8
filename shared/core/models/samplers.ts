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

/** Sampling parameters of one candidate. `switchRatio` = R_on / R_unit; `offsetSigma` = σ_os / V_REF. */
export interface SamplerParams {
  sigmaUnit: number
  switchRatio: number
  twoR: TwoRConstruction
  offsetSigma: number
  def: InlDefinition
}

function fillScaled(dst: Float64Array, z: Float64Array, from: number, nominal: number, sigma: number): void {
  for (let i = 0; i < dst.length; i++) {
    dst[i] = nominal * (1 + sigma * z[from + i]!)
  }
}

function ladderSampler(bits: number, p: SamplerParams): TrialSampler {
  const s2 = p.twoR === 'two-units' ? p.sigmaUnit * Math.SQRT1_2 : p.sigmaUnit
  const legs = new Float64Array(bits)
  const series = new Float64Array(bits - 1)
  const w = new Float64Array(bits)
  const d = new Float64Array(bits)
  const scratch = new Float64Array(256)
  return {
    key: `ladder:${bits}:${p.sigmaUnit}:${p.switchRatio}:${p.twoR}:${p.def}`,
    normals: 2 * bits,
    run(z, out, env) {
      fillScaled(legs, z, 0, 2, s2)
      fillScaled(series, z, bits, 1, p.sigmaUnit)
      const term = 2 * (1 + s2 * z[2 * bits - 1]!)
      ladderWeights(legs, series, term, p.switchRatio, w)
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
  const legCount = (1 << m) - 1
  const legs = new Float64Array(l)
  const series = new Float64Array(Math.max(0, l - 1))
  const binary = new Float64Array(l)
  const scratch = createSegmentedScratch(m, 256)
  const at = legCount
  const sw = p.switchRatio
  let g = legBuffer(legCount)
  const extremes = { hi: 0, lo: 0 }
  return {
    key: `segmented:${m}:${l}:${p.sigmaUnit}:${p.switchRatio}:${p.twoR}:${p.def}`,
    normals: at + 2 * l + 1,
    run(z, out, env) {
      const k = kernelsFor(z)
      let sumG: number
      if (k && at <= k.legs.length) {
        // The same pass in WebAssembly, into its leg buffer (which its unary scan then reads).
        g = k.legs.subarray(0, at)
        sumG = k.sampleLegs(at, 2 * s2, sw)
        extremes.hi = k.legHiIndex()
        extremes.lo = k.legLoIndex()
      } else {
        g = legBuffer(at, g)
        sumG = sampleLegs(g, z, 2 * s2, sw, extremes)
      }
      const joint = 1 + p.sigmaUnit * z[at]!
      fillScaled(legs, z, at + 1, 2, s2)
      fillScaled(series, z, at + 1 + l, 1, p.sigmaUnit)
      const term = 2 * (1 + s2 * z[at + 2 * l]!)
      const toLadder = joint + ladderRoutOhm(legs, series, term, sw)
      const xOut = 1 / (sumG + 1 / toLadder)
      ladderWeights(legs, series, term, sw, binary)
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
  const sample = { coarse, fine, buffered, offsetLo: 0, offsetHi: 0 }
  return {
    key: `two-stage:${m}:${l}:${buffered}:${p.sigmaUnit}:${p.offsetSigma}:${p.def}`,
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
