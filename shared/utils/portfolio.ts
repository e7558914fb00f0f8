/** The few numbers the portfolio shows for a study, taken from its head revision's results. */
export interface PortfolioSummary {
  /** the recommended candidate, null when none meets spec */
  candidateId: string | null
  /** its total area (mm²), null without a recommendation */
  areaMm2: number | null
  /** `fail` findings of the recommended candidate, or of all candidates when none is recommended */
  failCount: number
  meetingCount: number
  candidateCount: number
}

interface ResultsLike {
  recommendedId?: string | null
  candidates?: { id: string, meetsSpec?: boolean, metrics?: { totalAreaMm2?: number | null } }[]
  findings?: { candidateId: string, severity: string }[]
}

/** Summarises evaluation results (tolerates results saved before findings existed). */
export function portfolioSummary(results: ResultsLike): PortfolioSummary {
  const candidates = results.candidates ?? []
  const id = results.recommendedId ?? null
  const chosen = id === null ? undefined : candidates.find(c => c.id === id)
  const fails = (results.findings ?? []).filter(f => f.severity === 'fail' && (chosen ? f.candidateId === chosen.id : true))
  return {
    candidateId: chosen?.id ?? null,
    areaMm2: chosen?.metrics?.totalAreaMm2 ?? null,
    failCount: fails.length,
    meetingCount: candidates.filter(c => c.meetsSpec).length,
    candidateCount: candidates.length
  }
}
