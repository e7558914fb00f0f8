/**
 * Monte Carlo DNL envelope per code: a modest number of sampled circuits (envelopeSamples) (every unit resistor
 * drawn as R_u(1 + σ_u z), buffer offsets drawn for buffered two-stage strings) solved exactly,
 * the DNL of every one-code step against the study's line, and per bucket of codes the lowest
 * and highest value over all samples. The buckets are those of the nominal DNL series.
 *
 * The samples use their own random stream, `deriveSeed(seed, SERIES_STREAM, candidate index,
 * sample)`, so the Monte Carlo trials (seeded by chunk) and every recorded result are unchanged.
 */
import { buildCircuit } from '../circuits/index'
import type { EvaluateInput } from '../contract/evaluate'
import { solveCircuitLevels } from '../solve/index'
import { createFastNormalSource, deriveSeed } from '../stats/rng'
import type { CandidateContext } from './context'
import { circuitShapeOf, twoStageUnits } from './context'
import { dnlPerCode, linearityLine } from './series-nominal'

/** Most sampled circuits behind the DNL envelope (and never more than the run's trials). */
export const SERIES_MC_SAMPLES = 32

/**
 * Codes solved per candidate at most (samples × 2^N): every sample is a full exact solve, so
 * wide converters get fewer samples (16 bits: 4) and a 16-bit evaluation stays about as fast.
 */
export const SERIES_MC_CODE_BUDGET = 2 ** 18

/** Fewest samples of a wide converter, whatever the budget. */
export const SERIES_MC_MIN_SAMPLES = 4

/** First key of the envelope's seed path; the trial chunks use one key (the chunk index), never this. */
export const SERIES_STREAM = 0x5e71e5

/** The DNL envelope of one candidate (LSB); bucket i covers steps codes[i] … codes[i + 1] − 1. */
export interface DnlEnvelope {
  samples: number
  seed: number
  codes: number[]
  dnlMinLsb: number[]
  dnlMaxLsb: number[]
}

/** Number of samples for a run of `trials` trials at `bits` bits (none without Monte Carlo). */
export function envelopeSamples(trials: number, bits: number): number {
  const byBudget = Math.max(SERIES_MC_MIN_SAMPLES, Math.floor(SERIES_MC_CODE_BUDGET / 2 ** bits))
  return Math.min(trials, SERIES_MC_SAMPLES, byBudget)
}

/** The DNL envelope of candidate `index`, or null when the run has no trials. */
export function sampledDnlEnvelope(c: CandidateContext, index: number, input: EvaluateInput): DnlEnvelope | null {
  const { spec, process, options } = input
  const samples = envelopeSamples(options.trials, spec.bits)
  if (samples === 0) return null
  const steps = 2 ** spec.bits - 1
  const size = Math.max(1, Math.ceil(steps / options.envelopePoints))
  const buckets = Math.ceil(steps / size)
  const lo = new Array<number>(buckets).fill(Infinity)
  const hi = new Array<number>(buckets).fill(-Infinity)
  const dnl = new Float64Array(steps)
  for (let j = 0; j < samples; j++) {
    const circuit = buildCircuit(circuitShapeOf(c.shape), {
      unitOhm: c.sizing.unitOhm, vrefV: spec.vrefV, switchOhm: process.switchOhm, twoR: process.twoRConstruction,
      ...twoStageUnits(c.shape, c.sizing.unitOhm),
      sigmaUnit: c.sizing.sigmaUnit,
      sigmaOffsetV: process.bufferOffsetSigmaV,
      normal: createFastNormalSource(deriveSeed(options.seed, SERIES_STREAM, index, j))
    })
    const levels = solveCircuitLevels(circuit)
    dnlPerCode(levels, linearityLine(levels, options.inlDefinition).s, dnl)
    for (let b = 0; b < buckets; b++) {
      const end = Math.min(steps, (b + 1) * size)
      let l = lo[b]!
      let h = hi[b]!
      for (let k = b * size; k < end; k++) {
        const v = dnl[k]!
        l = v < l ? v : l
        h = v > h ? v : h
      }
      lo[b] = l
      hi[b] = h
    }
  }
  return { samples, seed: deriveSeed(options.seed, SERIES_STREAM, index), codes: Array.from({ length: buckets }, (_, b) => b * size), dnlMinLsb: lo, dnlMaxLsb: hi }
}
