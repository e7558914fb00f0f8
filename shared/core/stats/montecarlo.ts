/**
 * Monte Carlo driver for one chunk of trials over several candidates.
 *
 * Common random numbers: each trial fills ONE buffer of standard normals and every candidate
 * reads its element errors from the start of that buffer. Each candidate's marginal distribution
 * is exactly that of an independent run, but the 2^16 normals of a 16-bit string are drawn once
 * per trial instead of once per candidate (string, segmented M = 1 … 15, two-stage), which is
 * what brings a full 16-bit evaluation within its time budget; differences between candidates
 * also get smaller variance. Candidates with the same sampler key (direct/tree strings, equal
 * R-2R ladders) are computed once per trial.
 *
 * The generator is filled in two calls (z[0, prefix) then the rest): the same stream, in order.
 * It is the WebAssembly build of the generator where available (stats/wasm-kernels.ts), else
 * the JavaScript one: both write the same numbers.
 *
 * Reproducibility: the chunk's generator is seeded with deriveSeed(seed, chunkIndex) and chunks
 * have a fixed size chosen by the planner, so the merged result does not depend on how many
 * workers ran the chunks.
 */
import type { TrialSampler } from '../models/samplers'
import type { NormalsSummary } from './string-mc'
import type { McTally, TallyTargets } from './accumulator'
import { absorbEnvelope, addTrial, createTally } from './accumulator'
import type { Envelope } from './envelope'
import { createEnvelope } from './envelope'
import { newLinearityResult } from './linearity'
import type { LinearityResult } from './linearity'
import { createFastNormals, deriveSeed } from './rng'
import { claimWasmNormals } from './wasm-kernels'
import type { FilledRange } from './ziggurat'

/** One chunk of trials. */
export interface McChunk {
  seed: number
  chunkIndex: number
  trials: number
  bits: number
  envelopePoints: number
  /** widen the per-code INL envelope in this chunk's trials (an evaluation does so in its first chunk only, see tasks.ts) */
  envelope: boolean
  targets: TallyTargets
}

/**
 * Runs `chunk.trials` trials of every sampler on common random numbers.
 * @returns one tally per sampler, in the order given
 */
export function runMonteCarloChunk(chunk: McChunk, samplers: readonly TrialSampler[]): McTally[] {
  const seed = deriveSeed(chunk.seed, chunk.chunkIndex)
  const normals = samplers.reduce((mx, s) => Math.max(mx, s.normals), 0)
  // The WebAssembly generator writes the same stream into its own memory; else the JS one.
  const wasm = claimWasmNormals(seed, normals)
  try {
    return runTrials(chunk, samplers, normals, wasm ?? jsNormals(seed, normals))
  } finally {
    wasm?.release()
  }
}

/** A normal buffer and its generator: the JS fallback of `claimWasmNormals`. */
export interface NormalBuffer {
  z: Float64Array
  readonly filled: FilledRange
  fill: (start: number, end: number) => void
}

export function jsNormals(seed: number, count: number): NormalBuffer {
  const gen = createFastNormals(seed)
  const z = new Float64Array(count)
  return { z, filled: gen.filled, fill: (start, end) => gen.fill(z, start, end) }
}

function runTrials(chunk: McChunk, samplers: readonly TrialSampler[], normals: number, gen: NormalBuffer): McTally[] {
  const z = gen.z
  const keys = [...new Set(samplers.map(s => s.key))]
  const first = keys.map(k => samplers.find(s => s.key === k)!)
  const envs: Envelope[] = keys.map(() => createEnvelope(chunk.bits, chunk.envelopePoints))
  const results = keys.map(() => newLinearityResult())
  const tallies = keys.map(() => createTally(envs[0]?.min.length ?? 1))
  const shift = envs[0]?.shift ?? 0
  // The generator sums what it writes: filling z[0, prefix) on its own hands that sum (and the
  // extremes) to the samplers that asked for it, which saves them a pass over up to 2^16 normals.
  const prefix = Math.min(normals, first.find(s => s.summedPrefix !== undefined)?.summedPrefix ?? 0)
  const summary: NormalsSummary = { count: prefix, sum: 0, hiK: 0, loK: 0 }
  const given = first.map(s => (s.summedPrefix === prefix && prefix > 0 ? summary : undefined))
  for (let t = 0; t < chunk.trials; t++) {
    gen.fill(0, prefix)
    summary.sum = gen.filled.sum
    summary.hiK = gen.filled.hiK
    summary.loK = gen.filled.loK
    gen.fill(prefix, normals)
    for (let i = 0; i < first.length; i++) {
      first[i]!.run(z, results[i]!, chunk.envelope ? envs[i] : undefined, given[i])
      addTrial(tallies[i]!, results[i]!, chunk.targets, shift)
    }
  }
  tallies.forEach((tally, i) => {
    if (chunk.envelope) {
      absorbEnvelope(tally, envs[i]!, chunk.trials)
    } else {
      tally.envelopeMin = []
      tally.envelopeMax = []
    }
  })
  return samplers.map(s => tallies[keys.indexOf(s.key)]!)
}

/**
 * Runs `trials` trials of every sampler on common random numbers from `seed` (same generator and
 * buffer as a chunk) and hands each trial's result to `visit(trial, samplerIndex, result)`.
 * Samplers with equal keys are run once per trial. Used by the sampled sizing, which needs
 * each trial's extremes rather than pass counts.
 */
export function visitTrials(seed: number, trials: number, samplers: readonly TrialSampler[], visit: (trial: number, sampler: number, r: LinearityResult) => void): void {
  const normals = samplers.reduce((mx, s) => Math.max(mx, s.normals), 0)
  const wasm = claimWasmNormals(seed, normals)
  const gen = wasm ?? jsNormals(seed, normals)
  try {
    const keys = [...new Set(samplers.map(s => s.key))]
    const first = keys.map(k => samplers.find(s => s.key === k)!)
    const owner = samplers.map(s => keys.indexOf(s.key))
    const results = keys.map(() => newLinearityResult())
    const prefix = Math.min(normals, first.find(s => s.summedPrefix !== undefined)?.summedPrefix ?? 0)
    const summary: NormalsSummary = { count: prefix, sum: 0, hiK: 0, loK: 0 }
    const given = first.map(s => (s.summedPrefix === prefix && prefix > 0 ? summary : undefined))
    for (let t = 0; t < trials; t++) {
      gen.fill(0, prefix)
      summary.sum = gen.filled.sum
      summary.hiK = gen.filled.hiK
      summary.loK = gen.filled.loK
      gen.fill(prefix, normals)
      for (let i = 0; i < first.length; i++) first[i]!.run(gen.z, results[i]!, undefined, given[i])
      for (let j = 0; j < samplers.length; j++) visit(t, j, results[owner[j]!]!)
    }
  } finally {
    wasm?.release()
  }
}
