import bcrypt from 'bcryptjs'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'
import { evaluate, mailsMatching, post, studyWithResults, type Evaluated } from './review-support'

let db: Knex
const c = {} as Record<'admin' | 'architect' | 'engineer' | 'manager' | 'architect2' | 'otherTeam', string>
const ids = {} as Record<'architect' | 'engineer' | 'architect2', number>
let ev: Evaluated
const tag = `rv-${Date.now()}`

beforeAll(async () => {
  db = testDb()
  for (const role of ['admin', 'architect', 'engineer', 'manager'] as const) c[role] = await signIn(DEMO[role])
  const team = await db('teams').where({ slug: 'harrow-lake' }).first('id')
  const hash = await bcrypt.hash('second-architect-pass', 4)
  const [a2] = await db('users').insert({ team_id: team.id, email: `${tag}-a2@harrowlake.example`, display_name: 'Second Architect', password_hash: hash, role: 'architect' })
  c.architect2 = await signIn(`${tag}-a2@harrowlake.example`, 'second-architect-pass')
  const [other] = await db('teams').insert({ name: 'Review Other', slug: `${tag}-other` })
  await db('users').insert({ team_id: other, email: `${tag}@other.example`, display_name: 'Other', password_hash: hash, role: 'admin' })
  c.otherTeam = await signIn(`${tag}@other.example`, 'second-architect-pass')
  for (const role of ['architect', 'engineer'] as const) ids[role] = (await db('users').where({ email: DEMO[role] }).first('id')).id
  ids.architect2 = a2!
  ev = await evaluate(db, c.engineer)
}, 120_000)
afterAll(async () => {
  await db.destroy()
})

/** Engineer's study in review by the demo architect, signed off: ready for a decision. */
async function signedOff(title: string) {
  const id = await studyWithResults(c.engineer, ev, title)
  expect((await post(id, 'review-request', c.engineer, { statusVersion: 0, reviewerIds: [ids.architect] })).status).toBe(200)
  const s = await post(id, 'reviews', c.architect, { statusVersion: 1, verdict: 'signed_off', comment: 'Margins read well.' })
  expect(s.status).toBe(201)
  return { id, state: s.body, signOffId: s.body.entries.find(e => e.kind === 'signed_off')!.id }
}

const decisionBody = (statusVersion: number, signOffIds: number[], revision = 1) =>
  ({ statusVersion, candidateId: ev.recommendedId ?? ev.candidateIds[0]!, rationale: 'Smallest area that meets every target.', revision, signOffIds })

describe('review, sign-off and decision', () => {
  it('walks draft → in review → decided, mails each reviewer once and the owner and reviewers the decision, and logs each step', async () => {
    const title = `${tag} journey`
    const id = await studyWithResults(c.engineer, ev, title)
    const req = await post(id, 'review-request', c.engineer, { statusVersion: 0, reviewerIds: [ids.architect, ids.architect2] })
    expect(req.status).toBe(200)
    expect(req.body).toMatchObject({ status: 'in_review', statusVersion: 1 })
    const dir = inject('mailDir')
    for (const email of [DEMO.architect, `${tag}-a2@harrowlake.example`]) {
      const mails = await mailsMatching(dir, m => m.to.includes(email) && m.subject === `Review requested: ${title}`, 1)
      expect(mails).toHaveLength(1)
      expect(mails[0]!.text).toContain(`/studies/${id}`)
      expect(mails[0]!.html).toContain('Open the study')
    }
    const signed = await post(id, 'reviews', c.architect2, { statusVersion: 1, verdict: 'signed_off', comment: 'Checked the glitch budget.' })
    expect(signed.status).toBe(201)
    const signOff = signed.body.entries.find(e => e.kind === 'signed_off')!
    expect(signOff).toMatchObject({ revision: 1, comment: 'Checked the glitch budget.' })
    const decided = await post(id, 'decision', c.admin, decisionBody(2, [signOff.id]))
    expect(decided.status).toBe(201)
    expect(decided.body).toMatchObject({ status: 'decided', statusVersion: 3 })
    for (const email of [DEMO.engineer, DEMO.architect, `${tag}-a2@harrowlake.example`]) {
      expect(await mailsMatching(dir, m => m.to.includes(email) && m.subject === `Decided: ${title}`, 1)).toHaveLength(1)
    }
    const pf = await api<{ items: { id: number, chosenId: string | null, status: string }[] }>(`/api/portfolio?status=decided&q=${encodeURIComponent(title)}`, { cookie: c.manager })
    expect(pf.body.items).toEqual([expect.objectContaining({ id, status: 'decided', chosenId: decisionBody(0, []).candidateId })])
    const activity = await api<{ action: string }[]>(`/api/studies/${id}/activity`, { cookie: c.manager })
    expect(activity.body.map(a => a.action)).toEqual(['study.decided', 'study.signed_off', 'study.review_requested', 'revision_saved', 'study_created'])
    const audit = await db('audit_log').where({ target_type: 'study', target_id: String(id), action: 'study.decided' }).first('actor_id')
    expect(audit.actor_id).toBe((await db('users').where({ email: DEMO.admin }).first('id')).id)
  })

  it('keeps a decided study read-only; reopening copies the decided revision and keeps the decision as history', async () => {
    const { id, signOffId } = await signedOff(`${tag} reopen`)
    expect((await post(id, 'decision', c.architect, decisionBody(2, [signOffId]))).status).toBe(201)
    const edit = await api<{ message: string }>(`/api/studies/${id}/revisions`, { method: 'POST', cookie: c.engineer, body: { baseVersion: 1, ...ev.input } })
    expect(edit.status).toBe(423)
    expect(edit.body.message).toContain('decided and read-only')
    expect((await db('study_revisions').where({ study_id: id })).length).toBe(1)
    for (const who of ['manager', 'engineer'] as const) expect((await post(id, 'reopen', c[who], { statusVersion: 3 })).status).toBe(403)
    const reopened = await post(id, 'reopen', c.architect, { statusVersion: 3 })
    expect(reopened.status).toBe(200)
    expect(reopened.body).toMatchObject({ status: 'draft', version: 2 })
    expect(reopened.body.decisions[0]!.supersededAt).not.toBeNull()
    const [r1, r2] = await db('study_revisions').where({ study_id: id }).orderBy('number')
    const read = (v: unknown) => typeof v === 'string' ? JSON.parse(v) : v
    for (const k of ['spec', 'process', 'options', 'results'] as const) expect(read(r2[k])).toEqual(read(r1[k]))
    expect(await db('audit_log').where({ target_id: String(id), action: 'study.reopened' }).first('id')).toBeTruthy()
    expect((await api(`/api/studies/${id}/revisions`, { method: 'POST', cookie: c.engineer, body: { baseVersion: 2, ...ev.input, note: 'after reopen' } })).status).toBe(201)
    const pf = await api<{ items: { chosenId: string | null }[] }>(`/api/portfolio?q=${encodeURIComponent(`${tag} reopen`)}`, { cookie: c.manager })
    expect(pf.body.items[0]!.chosenId).toBeNull()
  })

  it('archives only decided studies, by architects and admins, and keeps them read-only', async () => {
    const { id, signOffId } = await signedOff(`${tag} archive`)
    expect((await post(id, 'archive', c.architect, { statusVersion: 2 })).status).toBe(409)
    expect((await post(id, 'decision', c.admin, decisionBody(2, [signOffId]))).status).toBe(201)
    expect((await post(id, 'archive', c.engineer, { statusVersion: 3 })).status).toBe(403)
    const archived = await post(id, 'archive', c.admin, { statusVersion: 3 })
    expect(archived.status).toBe(200)
    expect(archived.body.status).toBe('archived')
    expect((await api(`/api/studies/${id}/revisions`, { method: 'POST', cookie: c.architect, body: { baseVersion: 1, ...ev.input } })).status).toBe(423)
    expect((await post(id, 'reopen', c.architect, { statusVersion: 4 })).status).toBe(409)
    const pf = await api<{ items: { id: number }[] }>(`/api/portfolio?status=archived&q=${encodeURIComponent(`${tag} archive`)}`, { cookie: c.manager })
    expect(pf.body.items.map(r => r.id)).toEqual([id])
  })

  it('lets only the owner, architects and admins ask for review, naming team architects other than the owner', async () => {
    const seeded = await db('studies as s').join('users as u', 'u.id', 's.owner_id').where('u.email', DEMO.architect).first('s.id', 's.status_version')
    expect((await post(seeded.id, 'review-request', c.engineer, { statusVersion: seeded.status_version, reviewerIds: [ids.architect2] })).status).toBe(403)
    const id = await studyWithResults(c.engineer, ev, `${tag} request`)
    expect((await post(id, 'review-request', c.manager, { statusVersion: 0, reviewerIds: [ids.architect] })).status).toBe(403)
    expect((await post(id, 'review-request', c.otherTeam, { statusVersion: 0, reviewerIds: [ids.architect] })).status).toBe(404)
    const engineerNamed = await post(id, 'review-request', c.engineer, { statusVersion: 0, reviewerIds: [ids.engineer] })
    expect(engineerNamed.status).toBe(400)
    expect(engineerNamed.body.message).toContain('reviewerIds')
    expect((await post(id, 'review-request', c.engineer, { statusVersion: 0, reviewerIds: [] })).status).toBe(400)
    expect((await post(id, 'review-request', c.engineer, { statusVersion: 0, reviewerIds: [ids.architect, ids.architect] })).status).toBe(400)
    const stale = await post(id, 'review-request', c.engineer, { statusVersion: 7, reviewerIds: [ids.architect] })
    expect(stale.status).toBe(409)
    expect(stale.body.data?.currentStatusVersion).toBe(0)
    expect((await post(id, 'review-request', c.architect2, { statusVersion: 0, reviewerIds: [ids.architect] })).status).toBe(200)
    expect((await post(id, 'review-request', c.engineer, { statusVersion: 1, reviewerIds: [ids.architect] })).status).toBe(409)
    const empty = await api<{ id: number }>('/api/studies', { method: 'POST', cookie: c.engineer, body: { title: `${tag} empty`, spec: ev.input.spec } })
    expect((await post(empty.body.id, 'review-request', c.engineer, { statusVersion: 0, reviewerIds: [ids.architect] })).status).toBe(400)
    expect((await db('audit_log').where({ target_id: String(id), action: 'study.review_requested' })).length).toBe(1)
  })

  it('lets only a named architect who is not the author sign off or request changes (with a comment, back to Draft)', async () => {
    const own = await studyWithResults(c.architect, ev, `${tag} own`)
    expect((await post(own, 'review-request', c.architect, { statusVersion: 0, reviewerIds: [ids.architect2] })).status).toBe(200)
    const self = await post(own, 'reviews', c.architect, { statusVersion: 1, verdict: 'signed_off' })
    expect(self.status).toBe(403)
    expect(self.body.message).toContain('own this study')
    const id = await studyWithResults(c.engineer, ev, `${tag} verdicts`)
    expect((await post(id, 'review-request', c.engineer, { statusVersion: 0, reviewerIds: [ids.architect] })).status).toBe(200)
    for (const who of ['engineer', 'manager', 'admin'] as const) expect((await post(id, 'reviews', c[who], { statusVersion: 1, verdict: 'signed_off' })).status).toBe(403)
    expect((await post(id, 'reviews', c.architect2, { statusVersion: 1, verdict: 'signed_off' })).status).toBe(403)
    expect((await post(id, 'reviews', c.otherTeam, { statusVersion: 1, verdict: 'signed_off' })).status).toBe(403)
    const noComment = await post(id, 'reviews', c.architect, { statusVersion: 1, verdict: 'changes_requested' })
    expect(noComment.status).toBe(400)
    expect(noComment.body.message).toContain('comment')
    const changes = await post(id, 'reviews', c.architect, { statusVersion: 1, verdict: 'changes_requested', comment: 'Add the 10-bit segmented split.' })
    expect(changes.status).toBe(201)
    expect(changes.body).toMatchObject({ status: 'draft', statusVersion: 2 })
    expect((await post(id, 'reviews', c.architect, { statusVersion: 2, verdict: 'signed_off' })).status).toBe(409)
    expect(await db('audit_log').where({ target_id: String(id), action: 'study.changes_requested' }).first('id')).toBeTruthy()
  })

  it('decides only on the current revision with results, a candidate in them and a sign-off on it, by architects and admins', async () => {
    const { id, signOffId } = await signedOff(`${tag} decide`)
    for (const who of ['engineer', 'manager'] as const) expect((await post(id, 'decision', c[who], decisionBody(2, [signOffId]))).status).toBe(403)
    expect((await post(id, 'decision', c.otherTeam, decisionBody(2, [signOffId]))).status).toBe(404)
    const wrong = await post(id, 'decision', c.architect, { ...decisionBody(2, [signOffId]), candidateId: 'no-such-candidate' })
    expect(wrong.status).toBe(400)
    expect(wrong.body.message).toContain('candidateId')
    expect((await post(id, 'decision', c.architect, decisionBody(2, [signOffId], 2))).status).toBe(400)
    expect((await post(id, 'decision', c.architect, { ...decisionBody(2, [signOffId]), rationale: ' ' })).status).toBe(400)
    expect((await post(id, 'decision', c.architect, decisionBody(1, [signOffId]))).status).toBe(409)
    // A new revision during review: the sign-off was on revision 1, the decision needs one on revision 2.
    expect((await api(`/api/studies/${id}/revisions`, { method: 'POST', cookie: c.engineer, body: { baseVersion: 1, ...ev.input, evaluationId: ev.evaluationId } })).status).toBe(201)
    const stale = await post(id, 'decision', c.architect, decisionBody(2, [signOffId], 2))
    expect(stale.status).toBe(400)
    expect(stale.body.message).toContain('signOffIds')
    const again = await post(id, 'reviews', c.architect, { statusVersion: 2, verdict: 'signed_off' })
    const fresh = again.body.entries.find(e => e.kind === 'signed_off' && e.revision === 2)!
    expect((await post(id, 'decision', c.architect, decisionBody(3, [fresh.id], 2))).status).toBe(201)
    // Revision without results: no decision.
    const bare = await api<{ id: number }>('/api/studies', { method: 'POST', cookie: c.engineer, body: { title: `${tag} bare`, spec: ev.input.spec } })
    expect((await api(`/api/studies/${bare.body.id}/revisions`, { method: 'POST', cookie: c.engineer, body: { baseVersion: 0, ...ev.input } })).status).toBe(201)
    await post(bare.body.id, 'review-request', c.engineer, { statusVersion: 0, reviewerIds: [ids.architect] })
    const s = await post(bare.body.id, 'reviews', c.architect, { statusVersion: 1, verdict: 'signed_off' })
    const noResults = await post(bare.body.id, 'decision', c.architect, decisionBody(2, [s.body.entries.find(e => e.kind === 'signed_off')!.id]))
    expect(noResults.status).toBe(400)
    expect(noResults.body.message).toContain('no saved results')
  })

  it('reads the activity of a study from the audit log, including note actions that name the study', async () => {
    const id = await studyWithResults(c.engineer, ev, `${tag} activity`)
    const team = await db('teams').where({ slug: 'harrow-lake' }).first('id')
    // The shape the notes feature writes: action note.*, detail naming the study.
    await db('audit_log').insert({ team_id: team.id, actor_id: ids.engineer, action: 'note.created', target_type: 'note', target_id: '1', detail: JSON.stringify({ studyId: id }) })
    const res = await api<{ action: string, actor: string }[]>(`/api/studies/${id}/activity`, { cookie: c.manager })
    expect(res.body.map(a => a.action)).toEqual(['note.created', 'revision_saved', 'study_created'])
    expect((await api(`/api/studies/${id}/activity`, { cookie: c.otherTeam })).status).toBe(404)
  })
})
