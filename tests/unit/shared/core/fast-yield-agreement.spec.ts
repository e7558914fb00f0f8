/**
 * The fast yields (metrics.*YieldAnalytic, what the live preview shows) against the Monte Carlo
 * of the same evaluation, over random specs and processes: 8 to 14 bits, switch on-resistance
 * from 0 to 2 % of the unit, both INL definitions, yield targets from 90 % to 99.7 %.
 * Reference: the engine's own Monte Carlo (exact solves of independently seeded circuits) with
 * its Wilson 95 % interval (E. B. Wilson 1927, from memory), which the acceptance rule
 * widens by 0.03. A 95 % interval misses the true yield 5 % of the time by construction, so the
 * "same side of the target" rule is held to that rate: at most 2.5 % of the one-sided cases.
 */
import { describe, expect, it } from 'vitest'
import { evaluateSpec, parseEvaluateInput } from '#shared/core/evaluate'
import { wilsonInterval } from '#shared/core/stats/interval'

const SPECS = 50
const TRIALS = 1000

/** xorshift32: the specs are drawn from a fixed seed, so the test is the same on every run. */
function rng(seed: number): () => number {
  let s = seed >>> 0
  return () => {
    s ^= s << 13
    s >>>= 0
    s ^= s >> 17
    s ^= s << 5
    s >>>= 0
    return s / 2 ** 32
  }
}

function randomInput(r: () => number, i: number) {
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(r() * xs.length)]!
  const bits = 8 + Math.floor(r() * 7)
  const unitOhm = pick([2e3, 5e3, 10e3, 20e3])
  return {
    spec: {
      bits, vrefV: 2.5, updateRateHz: 1e5, loadCapacitanceF: 1e-12, areaBudgetMm2: 10, glitchLimitVs: 1e-6, powerBudgetW: 1,
      inlTargetLsb: pick([0.5, 1, 2]), dnlTargetLsb: pick([0.25, 0.5, 0.9]), yieldTarget: pick([0.9, 0.95, 0.99, 0.997]), monotonicRequired: r() < 0.8
    },
    process: {
      sheetOhmPerSq: 500, matchingPctUm: 0.5 + 2 * r(), matchingConvention: pick(['pair', 'single']), unitOhm,
      switchOhm: r() * 0.02 * unitOhm, switchSpreadPct: pick([0, 0, 20]), twoRConstruction: pick(['two-units', 'single-element'])
    },
    options: { trials: bits > 12 ? TRIALS / 2 : TRIALS, seed: 100 + i, inlDefinition: r() < 0.5 ? 'endpoint' : 'best-fit' }
  }
}

interface Tally { compared: number, off: string[], oneSided: number, wrongSide: string[], sized: number, short: string[] }

function check(t: Tally, raw: ReturnType<typeof randomInput>): void {
  const out = evaluateSpec(parseEvaluateInput(raw))
  const target = raw.spec.yieldTarget
  for (const c of out.candidates) {
    const m = c.metrics as Record<string, number | string | boolean | null>
    const trials = (c.linearity.monteCarlo as { trials: number }).trials
    const pairs = [['inlYieldAnalytic', 'inlYield'], ['dnlYieldAnalytic', 'dnlYield'], ['monotonicYieldAnalytic', 'monotonicYield']] as const
    for (const [fast, mc] of pairs) {
      const f = m[fast] as number
      const ci = wilsonInterval(Math.round((m[mc] as number) * trials), trials, 0.95)
      const where = `${raw.spec.bits}-bit ${raw.options.inlDefinition} ${c.id} ${fast} ${f.toFixed(4)} vs [${ci.low.toFixed(4)}, ${ci.high.toFixed(4)}]`
      t.compared++
      if (f < ci.low - 0.03 || f > ci.high + 0.03) t.off.push(where)
      if (ci.low >= target || ci.high < target) {
        t.oneSided++
        if ((ci.low >= target) !== (f >= target - 1e-9)) t.wrongSide.push(where)
      }
    }
    // a unit sized for the yield target reaches it in Monte Carlo (its interval, widened by 0.03)
    if (m.sizingFeasible === true && m.sizingLimitedBy !== 'min-size') {
      const all = wilsonInterval(Math.round((m.yield as number) * trials), trials, 0.95)
      t.sized++
      if (all.high + 0.03 < target) t.short.push(`${raw.spec.bits}-bit ${c.id} yield ${(m.yield as number).toFixed(4)} < ${target}`)
    }
  }
}

describe('fast yields agree with the Monte Carlo of the same evaluation', () => {
  it(`over ${SPECS} random specs and processes (8–14 bits, switches 0–2 % of the unit, both INL definitions)`, () => {
    const r = rng(20261205)
    const t: Tally = { compared: 0, off: [], oneSided: 0, wrongSide: [], sized: 0, short: [] }
    for (let i = 0; i < SPECS; i++) check(t, randomInput(r, i))
    console.log(`fast yields: ${t.compared - t.off.length} of ${t.compared} within the Monte Carlo interval ± 0.03; ${t.oneSided - t.wrongSide.length} of ${t.oneSided} one-sided cases on the same side; ${t.sized - t.short.length} of ${t.sized} sized candidates reach the target`)
    expect(t.compared).toBeGreaterThan(50 * 12 * 3)
    expect(t.off).toEqual([])
    expect(t.wrongSide.length, t.wrongSide.join('\n')).toBeLessThanOrEqual(Math.ceil(0.025 * t.oneSided))
    expect(t.short).toEqual([])
  }, 240_000)

  it('a nominally non-monotonic ladder gets a fast monotonic yield below 1 %, as its Monte Carlo does', () => {
    const out = evaluateSpec(parseEvaluateInput({
      spec: { bits: 12, vrefV: 2.5, updateRateHz: 1e5, loadCapacitanceF: 1e-12, areaBudgetMm2: 10, glitchLimitVs: 1e-6, powerBudgetW: 1, inlTargetLsb: 1, dnlTargetLsb: 0.5, yieldTarget: 0.997 },
      process: { sheetOhmPerSq: 500, matchingPctUm: 1, matchingConvention: 'pair', unitOhm: 10e3, switchOhm: 50 },
      options: { trials: 500, topologies: ['r2r-voltage'], switchHandling: 'none', switchScale: 1 }
    }))
    const m = out.candidates[0]!.metrics as Record<string, number>
    expect(m.systematicDnlLsb).toBeGreaterThan(1)
    expect(m.monotonicYieldAnalytic).toBeLessThan(0.01)
    expect(m.monotonicYield).toBeLessThan(0.01)
  })
})
