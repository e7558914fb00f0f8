/**
 * The WebAssembly Monte Carlo kernels against the TypeScript code they replace: the generator's
 * stream (FastNormalGenerator is the reference, itself checked statistically in rng.spec.ts),
 * whole Monte Carlo chunks on both paths, and the committed module against its source.
 * Reference: "derived" — each kernel must reproduce the TypeScript path bit for bit.
 */
import { describe, expect, it } from 'vitest'
import { compileKernels, moduleText } from '../../../../scripts/build-kernels'
import { KERNELS_WASM_BASE64 } from '#shared/core/stats/kernels-wasm'
import { candidateContexts } from '#shared/core/evaluation/context'
import { parseEvaluateInput } from '#shared/core/evaluate'
import { createSampler } from '#shared/core/models/samplers'
import { runMonteCarloChunk } from '#shared/core/stats/montecarlo'
import { createFastNormals } from '#shared/core/stats/rng'
import { claimWasmNormals, loadKernels } from '#shared/core/stats/wasm-kernels'

describe('WebAssembly kernels', () => {
  it('load in Node (the server, its workers and the CLI use them)', () => {
    expect(loadKernels()).not.toBeNull()
  })

  it('generate the same normal stream as FastNormalGenerator, with the same sums and first extremes', () => {
    for (const seed of [1, 7, 123456789, 2 ** 40 + 3]) {
      const w = claimWasmNormals(seed, 65536)!
      try {
        const js = createFastNormals(seed)
        const z = new Float64Array(65536)
        for (const [start, end] of [[0, 65535], [65535, 65536], [0, 1], [1, 4097], [0, 65536]] as const) {
          js.fill(z, start, end)
          w.fill(start, end)
          expect(Array.from(w.z.subarray(start, end))).toEqual(Array.from(z.subarray(start, end)))
          expect({ ...w.filled }).toEqual({ ...js.filled })
        }
      } finally {
        w.release()
      }
    }
  })

  it('lend their buffer to one chunk at a time', () => {
    const a = claimWasmNormals(1, 16)
    expect(a).not.toBeNull()
    expect(claimWasmNormals(2, 16)).toBeNull()
    a!.release()
    const b = claimWasmNormals(3, 16)
    expect(b).not.toBeNull()
    b!.release()
    expect(claimWasmNormals(4, 10 ** 6)).toBeNull()
  })

  it('give Monte Carlo chunks identical to the TypeScript path for every sampler kind (envelope on and off)', () => {
    for (const bits of [8, 12]) {
      const input = parseEvaluateInput({
        spec: { bits, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, refSourceOhm: 0, powerBudgetW: 1e-3 },
        process: { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair', unitOhm: 10000, switchOhm: 50 },
        options: { trials: 0, seed: 5 }
      })
      const samplers = candidateContexts(input).map(c => createSampler(c.shape, c.sampler))
      for (const envelope of [true, false]) {
        const chunk = { seed: 5, chunkIndex: 2, trials: 40, bits, envelopePoints: 64, envelope, targets: { inlTargetLsb: 0.5, dnlTargetLsb: 0.5, monotonicRequired: true } }
        const withKernels = runMonteCarloChunk(chunk, samplers)
        // holding the buffer sends the driver down the TypeScript path
        const hold = claimWasmNormals(0, 1)!
        let plain
        try {
          plain = runMonteCarloChunk(chunk, samplers)
        } finally {
          hold.release()
        }
        expect(withKernels).toEqual(plain)
      }
    }
  })

  it('are the module compiled from scripts/kernels/montecarlo.ts (run npm run build:kernels after editing it)', async () => {
    const text = moduleText(await compileKernels())
    expect(text).toContain(KERNELS_WASM_BASE64)
  }, 60_000)
})
