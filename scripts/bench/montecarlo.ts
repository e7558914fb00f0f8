/**
 * Monte Carlo benchmarks (section of `npm run bench`): INL/DNL yield of one 12-bit candidate,
 * sized for the example spec, on the engine's sampler + extraction path (envelopes on,
 * as in an evaluation). Targets from the issue: R-2R or segmented at 100,000 trials < 0.5 s;
 * string at 10,000 trials < 1 s. Median of three runs after a warm-up.
 */
import type { EvaluateInput } from '../../shared/core/contract/evaluate'
import { parseEvaluateInput } from '../../shared/core/evaluate'
import { candidateContexts } from '../../shared/core/evaluation/context'
import { createSampler } from '../../shared/core/models/samplers'
import { runMonteCarloChunk } from '../../shared/core/stats/montecarlo'
import type { BenchRow } from './solve'

/** The example request at a given resolution. */
export function exampleInput(bits: number, trials: number): EvaluateInput {
  return parseEvaluateInput({
    spec: {
      bits, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5,
      yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, refSourceOhm: 0, powerBudgetW: 1e-3
    },
    process: {
      sheetOhmPerSq: 1000, matchingPctUm: 1.0, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 50, switchSkewS: 1e-10,
      switchChargeC: 1e-15, switchAreaUm2: 4, gateAreaUm2: 2, layoutOverhead: 2, minWidthUm: 0.4, minLengthUm: 1
    },
    options: { trials, seed: 1, inlDefinition: 'endpoint' }
  })
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)]!
}

/** Seconds to run `trials` trials of the candidate `id` of the 12-bit example. */
function timeCandidate(id: string, trials: number): number {
  const input = exampleInput(12, 0)
  const c = candidateContexts(input).find(x => x.shape.id === id)!
  const sampler = createSampler(c.shape, c.sampler)
  const chunk = (n: number, i: number) => ({
    seed: 1, chunkIndex: i, trials: n, bits: 12, envelopePoints: 256, envelope: true,
    targets: { inlTargetLsb: 0.5, dnlTargetLsb: 0.5, monotonicRequired: true }
  })
  runMonteCarloChunk(chunk(Math.ceil(trials / 10), 99), [sampler])
  const times: number[] = []
  for (let r = 0; r < 3; r++) {
    const t0 = performance.now()
    runMonteCarloChunk(chunk(trials, r), [sampler])
    times.push((performance.now() - t0) / 1000)
  }
  return median(times)
}

/** Monte Carlo yield rows: value in seconds, pass when under target. */
export function runMonteCarloBench(): BenchRow[] {
  const cases: [string, string, number, number][] = [
    ['12-bit R-2R, 100,000 trials', 'r2r-voltage', 100_000, 0.5],
    ['12-bit segmented M=4, 100,000 trials', 'segmented-m4', 100_000, 0.5],
    ['12-bit string, 10,000 trials', 'string-direct', 10_000, 1]
  ]
  return cases.map(([name, id, trials, target]) => {
    const s = timeCandidate(id, trials)
    return { name: `Monte Carlo INL/DNL yield, ${name}`, value: s, unit: 's', target: `< ${target} s`, pass: s < target }
  })
}
