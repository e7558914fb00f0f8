import { describe, expect, it } from 'vitest'
import { portfolioSummary } from '../../../../shared/utils/portfolio'

// Invented result shapes (the same fields an evaluation carries), to pin down the counting rules.
const candidates = [
  { id: 'string-direct', meetsSpec: true, metrics: { totalAreaMm2: 0.031 } },
  { id: 'r2r-voltage', meetsSpec: false, metrics: { totalAreaMm2: 0.012 } },
  { id: 'segmented-m4', meetsSpec: true, metrics: { totalAreaMm2: 0.02 } }
]
const findings = [
  { candidateId: 'r2r-voltage', severity: 'fail' },
  { candidateId: 'r2r-voltage', severity: 'fail' },
  { candidateId: 'segmented-m4', severity: 'warn' },
  { candidateId: 'segmented-m4', severity: 'fail' }
]

describe('portfolioSummary', () => {
  it('reports the recommended option, its area and only its failing findings', () => {
    expect(portfolioSummary({ recommendedId: 'segmented-m4', candidates, findings })).toEqual({
      candidateId: 'segmented-m4', areaMm2: 0.02, failCount: 1, meetingCount: 2, candidateCount: 3
    })
  })

  it('counts every failing finding when nothing is recommended', () => {
    expect(portfolioSummary({ recommendedId: null, candidates, findings })).toMatchObject({ candidateId: null, areaMm2: null, failCount: 3 })
  })

  it('reads results saved before findings existed', () => {
    expect(portfolioSummary({ candidates })).toMatchObject({ candidateId: null, failCount: 0, candidateCount: 3 })
  })

  it('counts the chosen candidate\'s failing findings and area when a decision is in force (one definition with the brief)', () => {
    expect(portfolioSummary({ recommendedId: 'segmented-m4', candidates, findings }, 'r2r-voltage')).toEqual({
      candidateId: 'segmented-m4', areaMm2: 0.012, failCount: 2, meetingCount: 2, candidateCount: 3
    })
  })
})
