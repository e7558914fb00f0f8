import type { StudyStatus } from './studies'

export interface PersonDto { id: number, name: string }

/** A named reviewer or a verdict, on the revision that was current when it was given. */
export interface ReviewEntryDto {
  id: number
  round: number
  kind: 'assigned' | 'signed_off' | 'changes_requested'
  reviewer: PersonDto
  revision: number
  comment: string | null
  by: PersonDto
  createdAt: string
}

/** A recorded waiver of a failing line. */
export interface WaiverDto { line: string, label: string, by: string, reason: string }

export interface DecisionDto {
  id: number
  candidateId: string
  rationale: string
  revision: number
  signOffIds: number[]
  /** one per line the chosen candidate failed when it was decided: the line, who accepted it and why */
  waivers: WaiverDto[]
  decidedBy: PersonDto
  createdAt: string
  /** set when the study was reopened after this decision */
  supersededAt: string | null
}

/** The review state of a study: who was asked, what they said, and every decision. */
export interface ReviewStateDto {
  status: StudyStatus
  statusVersion: number
  version: number
  round: number
  reviewers: PersonDto[]
  entries: ReviewEntryDto[]
  decisions: DecisionDto[]
  /** team architects other than the owner, who may be named as reviewers */
  eligibleReviewers: PersonDto[]
}

/** One line of a study's activity history (from the audit log). */
export interface ActivityDto {
  id: number
  action: string
  actor: string | null
  detail: Record<string, unknown> | null
  createdAt: string
}
