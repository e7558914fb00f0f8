import { describe, expect, it } from 'vitest'
import type { SessionUser } from '../../../shared/types/auth'
import type { ReviewStateDto } from '../../../shared/types/review'
import type { StudyDto } from '../../../shared/types/studies'
import { activityWords, reviewPermits } from '../../../utils/reviewPermissions'

const user = (id: number, role: SessionUser['role']): SessionUser => ({ id, role, email: `${role}@x.example`, name: role, teamId: 1, teamName: 'T' })
const study = { id: 9, owner: { id: 3, name: 'Engineer' } } as StudyDto
const state = (over: Partial<ReviewStateDto> = {}): ReviewStateDto => ({
  status: 'draft', statusVersion: 0, version: 1, round: 0, reviewers: [], entries: [], decisions: [], eligibleReviewers: [{ id: 2, name: 'Architect' }], ...over
})

// The rules are the server's (server/utils/studyTransitions.ts); these cases mirror tests/api/review-flow.spec.ts.
describe('reviewPermits', () => {
  it('lets the owner and leads ask for review of a saved draft, never a manager or another engineer', () => {
    expect(reviewPermits(user(3, 'engineer'), study, state()).request).toBeNull()
    expect(reviewPermits(user(2, 'architect'), study, state()).request).toBeNull()
    expect(reviewPermits(user(4, 'engineer'), study, state()).request).toMatch(/owner/)
    expect(reviewPermits(user(5, 'manager'), study, state()).request).toMatch(/owner/)
    expect(reviewPermits(user(3, 'engineer'), study, state({ version: 0 })).request).toBe('Save a revision first')
    expect(reviewPermits(user(3, 'engineer'), study, state({ status: 'in_review' })).request).toMatch(/Draft/)
  })

  it('lets only a named architect who is not the owner give a verdict', () => {
    const inReview = state({ status: 'in_review', reviewers: [{ id: 2, name: 'Architect' }] })
    expect(reviewPermits(user(2, 'architect'), study, inReview).verdict).toBeNull()
    expect(reviewPermits(user(7, 'architect'), study, inReview).verdict).toMatch(/not named/)
    expect(reviewPermits(user(3, 'architect'), study, inReview).verdict).toMatch(/own this study/)
    expect(reviewPermits(user(1, 'admin'), study, inReview).verdict).toMatch(/architects/)
  })

  it('needs a sign-off on the current revision before a decision, by an architect or admin', () => {
    const signOff = { id: 1, round: 1, kind: 'signed_off' as const, reviewer: { id: 2, name: 'A' }, revision: 1, comment: null, by: { id: 2, name: 'A' }, createdAt: '' }
    expect(reviewPermits(user(1, 'admin'), study, state({ status: 'in_review', entries: [signOff] })).decide).toBeNull()
    expect(reviewPermits(user(1, 'admin'), study, state({ status: 'in_review', version: 2, entries: [signOff] })).decide).toMatch(/revision 2/)
    expect(reviewPermits(user(3, 'engineer'), study, state({ status: 'in_review', entries: [signOff] })).decide).toMatch(/architects and admins/)
    expect(reviewPermits(user(2, 'architect'), study, state({ status: 'decided' })).reopen).toBeNull()
    expect(reviewPermits(user(2, 'architect'), study, state({ status: 'archived' })).reopen).toMatch(/decided/)
  })

  it('words audit actions, including note actions it does not know yet', () => {
    expect(activityWords('study.signed_off')).toBe('signed off')
    expect(activityWords('note.resolved')).toBe('note: resolved')
  })
})
