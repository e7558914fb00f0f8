import { describe, expect, it } from 'vitest'
import type { EvaluateCandidate } from '#shared/core/contract/evaluate'
import { candidateFacts } from '#shared/findings/facts'
import { BUILT_IN_PACKS } from '#shared/findings/registry'
import { runFindings } from '#shared/findings/runner'
import { formatNumber } from '#shared/utils/format'
import { evaluated, VARIANTS } from './engine-fixtures'
import type { Variant } from './engine-fixtures'

interface Case { variant: Variant, candidate: string, edit?: (c: EvaluateCandidate) => EvaluateCandidate }
// Every built-in rule: a case the engine's own output fires it on, and one it stays silent on.
const FIXTURES: Record<string, { fires: Case, quiet: Case }> = {
  'inl-yield-short': { fires: { variant: 'mcSwitch', candidate: 'r2r-voltage' }, quiet: { variant: 'mcBase', candidate: 'r2r-voltage' } },
  // the sizing absorbs a moderate switch error into a smaller σ_u; a switch of 30 % of R cannot be sized away
  'dnl-yield-short': { fires: { variant: 'mcHugeSwitch', candidate: 'segmented-m3' }, quiet: { variant: 'bufferOffset', candidate: 'two-stage-buffered' } },
  'dnl-yield-short-two-stage': { fires: { variant: 'bufferOffset', candidate: 'two-stage-buffered' }, quiet: { variant: 'bufferOffset', candidate: 'two-stage-unbuffered' } },
  'monotonic-yield-short': { fires: { variant: 'mcSwitch', candidate: 'r2r-voltage' }, quiet: { variant: 'mcSwitchNoMono', candidate: 'r2r-voltage' } },
  'monotonic-yield-short-two-stage': { fires: { variant: 'bufferOffset', candidate: 'two-stage-buffered' }, quiet: { variant: 'bufferOffsetNoMono', candidate: 'two-stage-buffered' } },
  'nominal-non-monotonic': { fires: { variant: 'bigSwitch10', candidate: 'r2r-voltage' }, quiet: { variant: 'bigSwitch10NoMono', candidate: 'r2r-voltage' } },
  'monotonicity-at-risk': { fires: { variant: 'bigSwitch10NoMono', candidate: 'r2r-voltage' }, quiet: { variant: 'bigSwitch10', candidate: 'r2r-voltage' } },
  'area-over-budget': { fires: { variant: 'tinyArea', candidate: 'r2r-voltage' }, quiet: { variant: 'base', candidate: 'r2r-voltage' } },
  'area-near-budget': { fires: { variant: 'tinyArea', candidate: 'segmented-m4' }, quiet: { variant: 'tinyArea', candidate: 'segmented-m3' } },
  'update-rate-missed': { fires: { variant: 'tooFast', candidate: 'r2r-voltage' }, quiet: { variant: 'base', candidate: 'r2r-voltage' } },
  'update-rate-missed-string': { fires: { variant: 'base', candidate: 'string-tree' }, quiet: { variant: 'base', candidate: 'two-stage-buffered' } },
  'update-rate-missed-two-stage': { fires: { variant: 'base', candidate: 'two-stage-buffered' }, quiet: { variant: 'base', candidate: 'string-tree' } },
  'settling-margin-thin': { fires: { variant: 'fast', candidate: 'r2r-voltage' }, quiet: { variant: 'base', candidate: 'r2r-voltage' } },
  'glitch-over-limit': { fires: { variant: 'base', candidate: 'r2r-voltage' }, quiet: { variant: 'base', candidate: 'string-tree' } },
  'glitch-over-limit-string': { fires: { variant: 'base', candidate: 'string-tree' }, quiet: { variant: 'base', candidate: 'r2r-voltage' } },
  'major-carry-exposure': { fires: { variant: 'base', candidate: 'segmented-m2' }, quiet: { variant: 'base', candidate: 'segmented-m3' } },
  'reference-source-too-high': { fires: { variant: 'refR', candidate: 'r2r-voltage' }, quiet: { variant: 'refR', candidate: 'r2r-current' } },
  'reference-buffer-required': { fires: { variant: 'base', candidate: 'r2r-voltage' }, quiet: { variant: 'base', candidate: 'r2r-current' } },
  'output-buffer-needed': { fires: { variant: 'base', candidate: 'string-tree' }, quiet: { variant: 'base', candidate: 'r2r-voltage' } },
  'output-load-gain-error': { fires: { variant: 'refR', candidate: 'string-tree' }, quiet: { variant: 'refR', candidate: 'r2r-voltage' } },
  'output-load-gain-error-ladder': { fires: { variant: 'refR', candidate: 'r2r-voltage' }, quiet: { variant: 'refR', candidate: 'string-tree' } },
  'current-mode-amp-stability': { fires: { variant: 'base', candidate: 'r2r-current' }, quiet: { variant: 'base', candidate: 'r2r-voltage' } },
  'reference-power-over-budget': { fires: { variant: 'base', candidate: 'segmented-m4' }, quiet: { variant: 'base', candidate: 'segmented-m3' } },
  'reference-power-over-budget-unit': { fires: { variant: 'lowPower', candidate: 'r2r-voltage' }, quiet: { variant: 'lowPower', candidate: 'segmented-m4' } },
  'matching-beyond-process': { fires: { variant: 'tinyArea', candidate: 'segmented-m3' }, quiet: { variant: 'base', candidate: 'segmented-m3' } },
  // The engine never sizes a unit below the process minimum; this edit of its output (invented)
  // stands for a unit sized outside the engine.
  'unit-below-minimum-size': { fires: { variant: 'base', candidate: 'r2r-voltage', edit: c => ({ ...c, metrics: { ...c.metrics, unitWidthUm: 0.3 } }) }, quiet: { variant: 'base', candidate: 'r2r-voltage' } },
  'unit-at-minimum-size': { fires: { variant: 'base', candidate: 'string-tree' }, quiet: { variant: 'base', candidate: 'r2r-voltage' } },
  'switch-resistance-spoils-weights': { fires: { variant: 'base', candidate: 'r2r-voltage' }, quiet: { variant: 'noSwitchR', candidate: 'r2r-voltage' } },
  'string-element-growth': { fires: { variant: 'bits10', candidate: 'string-tree' }, quiet: { variant: 'base', candidate: 'string-tree' } },
  'fewest-unary-msbs': { fires: { variant: 'base', candidate: 'segmented-m2' }, quiet: { variant: 'base', candidate: 'segmented-m3' } }
}

async function findingsFor(c: Case) {
  const { input, output } = evaluated(c.variant)
  const candidates = output.candidates.map(x => (x.id === c.candidate && c.edit ? c.edit(x) : x))
  // A fixture naming a candidate the engine did not produce would pass its quiet case vacuously.
  if (!candidates.some(x => x.id === c.candidate)) throw new Error(`${c.variant} has no candidate ${c.candidate}`)
  const all = await runFindings(input, candidates, BUILT_IN_PACKS)
  return { all: all.filter(f => f.candidateId === c.candidate), candidate: candidates.find(x => x.id === c.candidate)!, input }
}

describe('built-in rule pack fixtures', () => {
  it('has a fires and a quiet fixture for every rule of the pack, and no fixture for a rule it lacks', () => {
    expect(Object.keys(FIXTURES).sort()).toEqual(BUILT_IN_PACKS[0]!.rules.map(r => r.id).sort())
  })

  it.each(Object.entries(FIXTURES))('%s fires on its fixture and stays quiet on the other', async (ruleId, { fires, quiet }) => {
    const hit = (await findingsFor(fires)).all.find(f => f.ruleId === ruleId)
    expect(hit, `${ruleId} on ${fires.variant}/${fires.candidate}`).toBeDefined()
    expect(hit!.explanation).not.toMatch(/\{|\}/)
    expect(hit!.action).not.toMatch(/\{|\}/)
    expect(hit!.basis.handbook.length).toBeGreaterThan(0)
    expect(hit!.packId).toBe('rungwise-core')
    expect((await findingsFor(quiet)).all.map(f => f.ruleId)).not.toContain(ruleId)
  })
})

describe('numbers in findings', () => {
  it('states the area and its share of the budget as the engine computed them', async () => {
    const { all, candidate, input } = await findingsFor(FIXTURES['area-over-budget']!.fires)
    const f = all.find(x => x.ruleId === 'area-over-budget')!
    const area = candidate.metrics.totalAreaMm2!
    expect(f.explanation).toContain(`${formatNumber(area)} mm²`)
    // derived: share = total area / budget
    expect(f.explanation).toContain(`${formatNumber((area / input.spec.areaBudgetMm2) * 100)} %`)
  })

  it('reports switch-induced DNL within 5 % of the handbook estimate 2^N·r/(6R)', async () => {
    const { all, candidate, input } = await findingsFor(FIXTURES['switch-resistance-spoils-weights']!.fires)
    const dnl = Math.abs(candidate.metrics.systematicDnlLsb as number)
    // handbook §4.4, first-order formula (derived there): 256 · 50 Ω / (6 · 10 kΩ) = 0.213 LSB
    const estimate = (2 ** input.spec.bits * input.process.switchOhm) / (6 * (input.process.unitOhm as number))
    expect(dnl / estimate).toBeGreaterThan(0.95)
    expect(dnl / estimate).toBeLessThan(1.05)
    expect(all.find(x => x.ruleId === 'switch-resistance-spoils-weights')!.explanation).toContain(`${formatNumber(dnl)} LSB`)
  })

  it('gives the I-V noise gain as 1 + R/R_out at the extremes of the pin resistance', async () => {
    const { all, candidate } = await findingsFor(FIXTURES['current-mode-amp-stability']!.fires)
    const m = candidate.metrics
    // handbook §2.3: noise gain 1 + R_fb/R_out(code) with R_fb = R
    const r = m.unitOhm as number
    const expected = [1 + r / m.routMaxOhm!, 1 + r / (m.routMinOhm as number)].map(v => formatNumber(v))
    const text = all.find(x => x.ruleId === 'current-mode-amp-stability')!.explanation
    for (const v of expected) expect(text).toContain(v)
  })
})

describe('findings agree with the engine', () => {
  it('reads the signed nominal DNL from the engine\'s per-code series and fails a required monotonicity at ≤ −1 LSB', async () => {
    const { all, candidate, input } = await findingsFor(FIXTURES['nominal-non-monotonic']!.fires)
    const facts = candidateFacts(input, [candidate])[0]!
    const perCode = (candidate.linearity as unknown as { perCode: { dnlLsb: { min: number[] } } }).perCode
    const min = facts.derived.systematicDnlMinLsb as number
    expect(min).toBe(Math.min(...perCode.dnlLsb.min))
    // The engine's unsigned figure is the same step's magnitude.
    expect(Math.abs(min)).toBeCloseTo(candidate.metrics.systematicDnlLsb as number, 9)
    // handbook §4.4 (derived there): mid-scale step ≈ −2^N·r/(6R) = −1024 · 600 Ω / (6 · 10 kΩ) = −10.24 LSB
    const estimate = -(2 ** input.spec.bits * input.process.switchOhm) / (6 * (input.process.unitOhm as number))
    expect(min / estimate).toBeGreaterThan(0.95)
    expect(min / estimate).toBeLessThan(1.05)
    const f = all.find(x => x.ruleId === 'nominal-non-monotonic')!
    expect(f.severity).toBe('fail')
    expect(f.explanation).toContain(`${formatNumber(min)} LSB`)
    // The fail replaces the risk: one finding, not a softer second one for the same step.
    expect(all.map(x => x.ruleId)).not.toContain('monotonicity-at-risk')
  })

  it('advises only changes that exist for the candidate\'s topology, on every fixture variant', async () => {
    const checked = new Set<string>()
    for (const v of Object.keys(VARIANTS) as Variant[]) {
      const { input, output } = evaluated(v)
      for (const f of await runFindings(input, output.candidates, BUILT_IN_PACKS)) {
        const topology = output.candidates.find(c => c.id === f.candidateId)!.topology
        const words = `${f.title} ${f.action}`
        checked.add(topology)
        // A string has no binary MSBs, legs or timing skew to fix (handbook §5, §2.1; common practice, no source).
        if (topology === 'string' || topology === 'two-stage-string') expect(words, `${v} ${f.candidateId} ${f.ruleId}`).not.toMatch(/unary|MSB|binary|\bleg|skew/i)
        // A ladder has no taps and no string resistance.
        else expect(words, `${v} ${f.candidateId} ${f.ruleId}`).not.toMatch(/\btaps?\b|string's|buffer offset/i)
        if (topology !== 'segmented') expect(words, `${v} ${f.candidateId} ${f.ruleId}`).not.toMatch(/fewer unary/i)
      }
    }
    expect([...checked].sort()).toEqual(['r2r-current', 'r2r-voltage', 'segmented', 'string', 'two-stage-string'])
  })
})
