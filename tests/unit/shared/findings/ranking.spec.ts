import { describe, expect, it } from 'vitest'
import { dominates, paretoFront, paretoView } from '#shared/findings/pareto'
import type { ParetoPoint } from '#shared/findings/pareto'
import { rankCandidates, weightedScore } from '#shared/findings/ranking'
import { weightChangesToSwitch } from '#shared/findings/recommend'
import type { Finding } from '#shared/findings/runner'
import { CRITERIA, DEFAULT_WEIGHTS } from '#shared/findings/weights'
import type { RankingWeights } from '#shared/findings/weights'
import { evaluated } from './engine-fixtures'

// Seeded invented points for the brute-force checks (not engine data).
function lcg(seed: number) {
  let s = seed >>> 0
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32)
}

function bruteFront(points: ParetoPoint[]): Set<string> {
  return new Set(points.filter(p => !points.some(q => q !== p && q.areaMm2 <= p.areaMm2 && q.margin >= p.margin && (q.areaMm2 < p.areaMm2 || q.margin > p.margin))).map(p => p.id))
}

describe('Pareto front', () => {
  it('matches the brute-force pairwise definition on 300 random sets, ties included', () => {
    const rnd = lcg(11)
    for (let t = 0; t < 300; t++) {
      const n = 1 + Math.floor(rnd() * 14)
      const pts = Array.from({ length: n }, (_, i) => ({ id: `c${i}`, areaMm2: Math.floor(rnd() * 5), margin: Math.floor(rnd() * 5) }))
      expect([...paretoFront(pts)].sort()).toEqual([...bruteFront(pts)].sort())
    }
  })

  it('lists the dominators of each engine candidate, none for those on the front', () => {
    const { input, output } = evaluated('base')
    for (const e of paretoView(input, output.candidates, 'inl')) {
      expect(e.onFront).toBe(e.dominatedBy.length === 0)
    }
  })
})

const weightsRnd = (rnd: () => number): RankingWeights => Object.fromEntries(CRITERIA.map(c => [c, Math.round(rnd() * 10)])) as RankingWeights

describe('ranking', () => {
  const { input, output } = evaluated('base')
  const candidates = output.candidates
  const noFindings: Finding[] = []

  it('ranks by the weighted score and never ranks a candidate with a hard failure', () => {
    const fail = { ruleId: 'x', packId: 'p', packVersion: 1, severity: 'fail', candidateId: 'segmented-m3' } as Finding
    const ranked = rankCandidates(input, candidates, [fail], DEFAULT_WEIGHTS)
    const m3 = ranked.find(r => r.candidateId === 'segmented-m3')!
    expect(m3.rank).toBeNull()
    const ok = ranked.filter(r => r.meetsSpec)
    ok.forEach((r, i) => expect(r.rank).toBe(i + 1))
    for (let i = 1; i < ok.length; i++) expect(ok[i - 1]!.score!).toBeGreaterThanOrEqual(ok[i]!.score!)
  })

  it('with only the area weight, orders by total area', () => {
    const w = { ...Object.fromEntries(CRITERIA.map(c => [c, 0])), area: 1 } as RankingWeights
    const areas = rankCandidates(input, candidates, noFindings, w).map(r => candidates.find(c => c.id === r.candidateId)!.metrics.totalAreaMm2!)
    expect(areas).toEqual([...areas].sort((a, b) => a - b))
  })

  it('scores a candidate that is no worse on every criterion at least as high (brute force over pairs and weights)', () => {
    const rnd = lcg(5)
    for (let t = 0; t < 40; t++) {
      const ranked = rankCandidates(input, candidates, noFindings, weightsRnd(rnd))
      for (const a of ranked) {
        for (const b of ranked) {
          if (CRITERIA.every(k => a.values[k] <= b.values[k])) expect(a.score!).toBeGreaterThanOrEqual(b.score! - 1e-9)
        }
      }
    }
  })

  it('does not depend on the order candidates arrive in', () => {
    const a = rankCandidates(input, candidates, noFindings, DEFAULT_WEIGHTS).map(r => r.candidateId)
    const b = rankCandidates(input, [...candidates].reverse(), noFindings, DEFAULT_WEIGHTS).map(r => r.candidateId)
    expect(b).toEqual(a)
  })

  it('a suggested weight change really lets the runner-up overtake, and stopping short does not', () => {
    const rnd = lcg(9)
    let checked = 0
    for (let t = 0; t < 30; t++) {
      const w = weightsRnd(rnd)
      if (CRITERIA.every(k => w[k] === 0)) continue
      const [rec, run] = rankCandidates(input, candidates, noFindings, w)
      for (const change of weightChangesToSwitch(rec!, run!, w)) {
        const k = CRITERIA.find(c => change.includes(`raise the ${c === 'yieldMargin' ? 'yield margin' : c === 'referenceLoad' ? 'reference load' : c === 'settlingMargin' ? 'settling margin' : c} weight`))!
        const needed = Number(change.split('above ')[1])
        const above = { ...w, [k]: needed * 1.01 + 1e-6 }
        const below = { ...w, [k]: w[k] + (needed - w[k]) * 0.98 }
        expect(weightedScore(run!.badness, above)).toBeGreaterThan(weightedScore(rec!.badness, above))
        expect(weightedScore(run!.badness, below)).toBeLessThanOrEqual(weightedScore(rec!.badness, below))
        checked++
      }
    }
    expect(checked).toBeGreaterThan(0)
  })

  it('dominates is a strict partial order', () => {
    const p = (areaMm2: number, margin: number) => ({ id: `${areaMm2}/${margin}`, areaMm2, margin })
    expect(dominates(p(1, 2), p(1, 2))).toBe(false)
    expect(dominates(p(1, 2), p(2, 2))).toBe(true)
    expect(dominates(p(1, 1), p(2, 2))).toBe(false)
  })
})

describe('applying findings to an evaluation', () => {
  it('adds findings, ranking, recommendation and rulePacks and leaves every engine field as it was', async () => {
    const { applyFindings } = await import('#shared/findings')
    const { input, output } = evaluated('base')
    const out = await applyFindings(input, output)
    expect(out.candidates).toEqual(output.candidates)
    expect(out.recommendedId).toBe(output.recommendedId)
    expect(out.rulePacks).toEqual([{ id: 'rungwise-core', version: 1, source: 'built-in' }])
    const rec = out.recommendation.candidateId!
    expect(out.findings.filter(f => f.candidateId === rec && f.severity === 'fail')).toEqual([])
    expect(out.recommendation.runnerUp?.candidateId).toBe(out.ranking.candidates[1]!.candidateId)
    expect(out.recommendation.reasons.join(' ')).toContain('mm²')
  })
})
