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
import { createFastNormals, deriveSeed } from './rng'

/** One chunk of trials. */
export interface McChunk {
  seed: number
  chunkIndex: number
  trials: number
  bits: number
  envelopePoints: number
  targets: TallyTargets
}

/**
 * Runs `chunk.trials` trials of every sampler on common random numbers.
 * @returns one tally per sampler, in the order given
 */
export function runMonteCarloChunk(chunk: McChunk, samplers: readonly TrialSampler[]): McTally[] {
  const gen = createFastNormals(deriveSeed(chunk.seed, chunk.chunkIndex))
  const normals = samplers.reduce((mx, s) => Math.max(mx, s.normals), 0)
  const z = new Float64Array(normals)
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
    gen.fill(z, 0, prefix)
    summary.sum = gen.filled.sum
    summary.hiK = gen.filled.hiK
    summary.loK = gen.filled.loK
    gen.fill(z, prefix, normals)
    for (let i = 0; i < first.length; i++) {
      first[i]!.run(z, results[i]!, envs[i], given[i])
      addTrial(tallies[i]!, results[i]!, chunk.targets, shift)
    }
  }
  tallies.forEach((tally, i) => absorbEnvelope(tally, envs[i]!))
  return samplers.map(s => tallies[keys.indexOf(s.key)]!)
}
