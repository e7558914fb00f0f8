import type { WaiverDto } from './review'
import type { StudyStatus } from './studies'

/** One line of "area and risk against the spec" for the chosen (or recommended) candidate. */
/** `meets` is the engine's verdict; `unsettled`: a Monte Carlo yield whose interval holds the target (meets null). */
export interface BriefLine { label: string, value: string, target: string, meets: boolean | null, unsettled?: boolean }

/** The one-page summary of a study, in plain words (the page and the PDF read the same). */
export interface BriefDto {
  study: { id: number, title: string, blockName: string | null, owner: string, status: StudyStatus, revision: number }
  /** what was asked: the spec in sentences */
  asked: string[]
  evaluated: boolean
  /** the decision in force, with a waiver for each line the chosen candidate fails */
  decision: { candidateId: string, label: string, rationale: string, decidedBy: string, decidedAt: string, revision: number, waivers: WaiverDto[] } | null
  recommendation: { candidateId: string, label: string, reasons: string[] } | null
  /** the candidate the lines describe: the decided one, else the recommended one */
  subject: { candidateId: string, label: string, basis: 'decision' | 'recommendation', lines: BriefLine[] } | null
  topFindings: { severity: string, title: string, label: string }[]
  open: {
    /** failing and risk findings of the subject candidate */
    unresolved: { severity: string, title: string }[]
    /** open notes: null until the notes feature reports them */
    openNotes: number | null
  }
  /** `fail` findings of the subject (of every candidate when there is none), counted as the portfolio counts them */
  failCount: number | null
  signOffs: { name: string, revision: number, at: string, comment: string | null }[]
  caution: string
  generatedAt: string
}
