import { subjectFailFindings } from './recommendation'

/** The few numbers the portfolio shows for a study, taken from its head revision's results. */
export interface PortfolioSummary {
  /** the recommended candidate, null when none meets spec */
  candidateId: string | null
  /** the subject's total area (mm²): the chosen candidate, else the recommended one; null without either */
  areaMm2: number | null
  /** `fail` findings of the subject (chosen, else recommended), or of all candidates when there is none */
  failCount: number
  meetingCount: number
  candidateCount: number
}

interface ResultsLike {
  recommendedId?: string | null
  candidates?: { id: string, meetsSpec?: boolean, metrics?: { totalAreaMm2?: number | null } }[]
  findings?: { candidateId: string, severity: string }[]
}

/** Summarises evaluation results (tolerates results saved before findings existed); `chosenId` is a decision in force. */
export function portfolioSummary(results: ResultsLike, chosenId: string | null = null): PortfolioSummary {
  const candidates = results.candidates ?? []
  const recommended = results.recommendedId ? candidates.find(c => c.id === results.recommendedId) : undefined
  const chosen = chosenId ? candidates.find(c => c.id === chosenId) : undefined
  const subject = chosen ?? recommended
  return {
    candidateId: recommended?.id ?? null,
    areaMm2: subject?.metrics?.totalAreaMm2 ?? null,
    failCount: subjectFailFindings(results.findings, subject?.id ?? null).length,
    meetingCount: candidates.filter(c => c.meetsSpec).length,
    candidateCount: candidates.length
  }
}
