import type { Fixtures, MatrixRow } from './authorization-table'

/** Matrix rows for review, sign-off, decision, activity and the brief. */
const SPEC = { bits: 8, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }
const READ_OWN = { signedOut: 401, admin: 200, architect: 200, engineer: 200, manager: 200, otherTeam: 404 }
const LEADS = { signedOut: 401, admin: 200, architect: 200, engineer: 403, manager: 403, otherTeam: 404 }

const userId = async (f: Fixtures, email: string) => (await f.db('users').where({ email }).first('id')).id as number

/**
 * A fresh study of the demo engineer at revision 1 (with a one-candidate result) in `status`;
 * in review by the demo architect, signed off when `signedOff`. Returns its id.
 */
async function studyIn(f: Fixtures, status: 'draft' | 'in_review' | 'decided', signedOff = false): Promise<{ id: number, signOffId: number | null }> {
  const engineer = await f.db('users').where({ email: 'engineer@harrowlake.example' }).first('id', 'team_id')
  const architect = await userId(f, 'architect@harrowlake.example')
  const [id] = await f.db('studies').insert({ team_id: engineer.team_id, owner_id: engineer.id, title: `Matrix review ${Date.now()}`, spec: JSON.stringify(SPEC), status, version: 1 })
  await f.db('study_revisions').insert({
    study_id: id, number: 1, spec: JSON.stringify(SPEC), process: '{}', options: '{}', engine_version: 'matrix',
    results: JSON.stringify({ candidates: [{ id: 'matrix-c' }] }), author_id: engineer.id
  })
  if (status !== 'in_review') return { id: id!, signOffId: null }
  await f.db('study_reviews').insert({ study_id: id, round: 1, kind: 'assigned', reviewer_id: architect, revision_number: 1, created_by: engineer.id })
  if (!signedOff) return { id: id!, signOffId: null }
  const [signOffId] = await f.db('study_reviews').insert({ study_id: id, round: 1, kind: 'signed_off', reviewer_id: architect, revision_number: 1, created_by: architect })
  return { id: id!, signOffId: signOffId! }
}

export const REVIEW_ROWS: MatrixRow[] = [
  { route: 'GET /api/studies/:id/review', expect: READ_OWN, request: f => ({ path: `/api/studies/${f.ownStudyId}/review` }) },
  { route: 'GET /api/studies/:id/activity', expect: READ_OWN, request: f => ({ path: `/api/studies/${f.ownStudyId}/activity` }) },
  { route: 'GET /api/studies/:id/brief', expect: READ_OWN, request: f => ({ path: `/api/studies/${f.ownStudyId}/brief` }) },
  { route: 'GET /api/studies/:id/brief.pdf', expect: READ_OWN, request: f => ({ path: `/api/studies/${f.ownStudyId}/brief.pdf` }) },
  {
    // The engineer owns the study; the architect and the admin may ask on anyone's behalf.
    route: 'POST /api/studies/:id/review-request',
    expect: { signedOut: 401, admin: 200, architect: 200, engineer: 200, manager: 403, otherTeam: 404 },
    request: async (f) => {
      const { id } = await studyIn(f, 'draft')
      return { path: `/api/studies/${id}/review-request`, body: { statusVersion: 0, reviewerIds: [await userId(f, 'architect@harrowlake.example')] } }
    }
  },
  {
    // Only the named architect reviews; the role is checked before the team.
    route: 'POST /api/studies/:id/reviews',
    expect: { signedOut: 401, admin: 403, architect: 201, engineer: 403, manager: 403, otherTeam: 403, otherArchitect: 404 },
    request: async (f) => {
      const { id } = await studyIn(f, 'in_review')
      return { path: `/api/studies/${id}/reviews`, body: { statusVersion: 0, verdict: 'signed_off' } }
    }
  },
  {
    route: 'POST /api/studies/:id/decision',
    expect: { ...LEADS, admin: 201, architect: 201 },
    request: async (f) => {
      const { id, signOffId } = await studyIn(f, 'in_review', true)
      return { path: `/api/studies/${id}/decision`, body: { statusVersion: 0, candidateId: 'matrix-c', rationale: 'Matrix decision', revision: 1, signOffIds: [signOffId] } }
    }
  },
  {
    route: 'POST /api/studies/:id/reopen',
    expect: LEADS,
    request: async f => ({ path: `/api/studies/${(await studyIn(f, 'decided')).id}/reopen`, body: { statusVersion: 0 } })
  },
  {
    route: 'POST /api/studies/:id/archive',
    expect: LEADS,
    request: async f => ({ path: `/api/studies/${(await studyIn(f, 'decided')).id}/archive`, body: { statusVersion: 0 } })
  }
]
