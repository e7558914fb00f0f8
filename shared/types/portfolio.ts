import type { StudyStatus } from './studies'

/** One study as the program manager's portfolio lists it. */
export interface PortfolioRow {
  id: number
  title: string
  blockName: string | null
  status: StudyStatus
  bits: number | null
  owner: string
  revision: number
  /** the recommended option of the head revision's results (null: none meets spec, or not evaluated) */
  recommendedId: string | null
  /** the candidate chosen by the decision in force (decided and archived studies), else null */
  chosenId: string | null
  /** the chosen candidate in words when decided, else the recommended one's (null: neither) */
  label: string | null
  /** waivers of the decision in force (lines the chosen candidate fails), null without a decision */
  waiverCount: number | null
  evaluated: boolean
  /** total area of the chosen candidate when decided, else of the recommended one */
  areaMm2: number | null
  areaBudgetMm2: number | null
  failCount: number | null
  meetingCount: number | null
  candidateCount: number | null
  /** threads of notes neither resolved nor deleted */
  openNotes: number
  lastActivityAt: string
}

export interface PortfolioPage { items: PortfolioRow[], page: number, pageSize: number, total: number }
