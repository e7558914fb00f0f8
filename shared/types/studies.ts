import type { StudySpec } from '../schemas/study'

export const STUDY_STATUSES = ['draft', 'in_review', 'decided', 'archived'] as const
export type StudyStatus = typeof STUDY_STATUSES[number]

/** A study as the API returns it. */
export interface StudyDto {
  id: number
  title: string
  blockName: string | null
  status: StudyStatus
  spec: StudySpec
  version: number
  /** counts status changes; a status change names it and gets 409 when stale */
  statusVersion: number
  owner: { id: number, name: string }
  /** the head revision's one recommendation (null: none meets spec, or no results) */
  recommendedId: string | null
  /** the candidate of the decision in force, else null */
  chosenId: string | null
  createdAt: string
  updatedAt: string
}

export interface StudyPage {
  items: StudyDto[]
  page: number
  pageSize: number
  total: number
}
