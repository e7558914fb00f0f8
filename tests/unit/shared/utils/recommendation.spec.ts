import { describe, expect, it } from 'vitest'
import { evaluateSpec, parseEvaluateInput } from '../../../../shared/core/evaluate'
import { applyFindings } from '../../../../shared/findings/index'
import { BUILT_IN_PACKS } from '../../../../shared/findings/registry'
import { failingLines, recommendResults, subjectFailFindings } from '../../../../shared/utils/recommendation'

// The rules checked here are the product's own ("one recommendation, one definition of failing":
// common practice, no source); the engine's numbers are not pinned.
const input = parseEvaluateInput({
  spec: { bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 },
  process: { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' },
  options: { trials: 0 }
})
const WEIGHTS = { area: 0, yieldMargin: 0, glitch: 10, referenceLoad: 0, settlingMargin: 10, power: 0, complexity: 10 }

describe('recommendResults', () => {
  it('writes one pick into recommendedId, the ranking and the stored recommendation, with the weights given', async () => {
    const out = await applyFindings(input, evaluateSpec(input))
    const { results, recommendation } = recommendResults(input, out, WEIGHTS, c => `name of ${c.id}`)
    const r = results as typeof results & { recommendedId: string | null, ranking: { weights: object, candidates: { candidateId: string, meetsSpec: boolean }[] }, recommendation: { candidateId: string | null } }
    expect(r.recommendedId).toBe(recommendation.candidateId)
    expect(r.recommendation.candidateId).toBe(recommendation.candidateId)
    expect(r.ranking.weights).toEqual(WEIGHTS)
    expect(recommendation.weights).toEqual(WEIGHTS)
    // the pick is the first ranked candidate that meets spec, named by the labeller
    const first = r.ranking.candidates.find(c => c.meetsSpec)
    expect(recommendation.candidateId).toBe(first?.candidateId ?? null)
    expect(recommendation.label).toBe(first ? `name of ${first.candidateId}` : null)
  })
})

describe('failingLines and subjectFailFindings', () => {
  const builtIn = BUILT_IN_PACKS[0]!.id
  const results = {
    candidates: [{ id: 'a', failing: ['area', 'glitch'] }, { id: 'b', failing: [] }],
    findings: [
      { candidateId: 'a', severity: 'fail', packId: builtIn, ruleId: 'area-over-budget', title: 'Area over budget' },
      { candidateId: 'a', severity: 'fail', packId: 'team-layout', ruleId: 'too-many-switches', title: 'Too many switches' },
      { candidateId: 'b', severity: 'warn', packId: 'team-layout', ruleId: 'near', title: 'Near' }
    ]
  }

  it('lists the engine\'s spec lines and team-pack fails once each, and nothing for a candidate that meets every line', () => {
    expect(failingLines(results, 'a').map(l => l.key)).toEqual(['area', 'glitch', 'team-layout/too-many-switches'])
    expect(failingLines(results, 'b')).toEqual([])
    expect(failingLines(results, 'missing')).toEqual([])
  })

  it('counts the subject\'s fail findings, or every candidate\'s without a subject', () => {
    expect(subjectFailFindings(results.findings, 'a')).toHaveLength(2)
    expect(subjectFailFindings(results.findings, 'b')).toHaveLength(0)
    expect(subjectFailFindings(results.findings, null)).toHaveLength(2)
  })
})
