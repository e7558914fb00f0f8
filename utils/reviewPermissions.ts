import type { SessionUser } from '#shared/types/auth'
import type { ReviewStateDto } from '#shared/types/review'
import type { StudyDto } from '#shared/types/studies'

/** null: allowed; text: why not (shown beside the disabled control). */
export type Permit = string | null

export interface ReviewPermits {
  request: Permit
  verdict: Permit
  decide: Permit
  reopen: Permit
  archive: Permit
}

const ARCHITECT_OR_ADMIN = 'Only architects and admins can do this'

function requestPermit(lead: boolean, own: boolean, role: string, state: ReviewStateDto): Permit {
  if (role === 'manager' || (!own && !lead)) return 'Only the owner, an architect or an admin can ask for review'
  if (state.status !== 'draft') return 'Only a Draft study can be sent for review'
  if (state.version < 1) return 'Save a revision first'
  if (state.eligibleReviewers.length === 0) return 'Your team has no architect other than the owner'
  return null
}

function verdictPermit(user: SessionUser | null, own: boolean, state: ReviewStateDto): Permit {
  if (user?.role !== 'architect') return 'Only architects sign off'
  if (own) return 'You own this study: another architect has to review it'
  if (state.status !== 'in_review') return 'The study is not in review'
  if (!state.reviewers.some(r => r.id === user.id)) return 'You were not named as a reviewer'
  return null
}

function decidePermit(lead: boolean, state: ReviewStateDto): Permit {
  if (!lead) return ARCHITECT_OR_ADMIN
  if (state.status !== 'in_review') return 'The study is not in review'
  if (!state.entries.some(e => e.kind === 'signed_off' && e.revision === state.version)) return `A decision needs a sign-off on revision ${state.version}`
  return null
}

/** The same rules the server applies (server/utils/studyTransitions.ts), for the controls of the study page. */
export function reviewPermits(user: SessionUser | null, study: StudyDto, state: ReviewStateDto): ReviewPermits {
  const role = user?.role ?? 'manager'
  const lead = role === 'architect' || role === 'admin'
  const own = user?.id === study.owner.id
  const fromDecided = (what: string): Permit => (!lead ? ARCHITECT_OR_ADMIN : state.status !== 'decided' ? `Only a decided study can be ${what}` : null)
  return {
    request: requestPermit(lead, own, role, state),
    verdict: verdictPermit(user, own, state),
    decide: decidePermit(lead, state),
    reopen: fromDecided('reopened'),
    archive: fromDecided('archived')
  }
}

/** Words for the audit actions of a study's activity (unknown actions, such as future ones, keep their name). */
export const ACTIVITY_WORDS: Record<string, string> = {
  'study_created': 'created the study',
  'revision_saved': 'saved a revision',
  'study.review_requested': 'asked for review',
  'study.signed_off': 'signed off',
  'study.changes_requested': 'requested changes',
  'study.decided': 'recorded the decision',
  'study.reopened': 'reopened the study',
  'study.archived': 'archived the study'
}

export function activityWords(action: string): string {
  if (ACTIVITY_WORDS[action]) return ACTIVITY_WORDS[action]!
  if (action.startsWith('note.')) return `note: ${action.slice(5).replace(/_/g, ' ')}`
  return action.replace(/[._]/g, ' ')
}
