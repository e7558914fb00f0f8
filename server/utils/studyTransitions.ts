import type { Knex } from 'knex'
import type { EvaluateCandidate } from '#shared/core/contract/evaluate'
import type { DecisionCreate, ReviewRequest, ReviewVerdict } from '#shared/schemas/review'
import type { SessionUser } from '#shared/types/auth'
import type { WaiverDto } from '#shared/types/review'
import { failingLines } from '#shared/utils/recommendation'
import { candidateLabel } from '../../utils/candidateLabel'
import { writeRevision } from '../db/writeRevision'
import { decisionMail, reviewRequestMail } from '../mail/reviewTemplates'

type Trx = Knex.Transaction
type DecisionResults = Parameters<typeof portfolioSummary>[0] & Parameters<typeof failingLines>[0]
const json = (v: unknown) => typeof v === 'string' ? JSON.parse(v) : v
const mayActOnAny = (user: SessionUser) => user.role === 'architect' || user.role === 'admin'

async function moveStatus(trx: Trx, row: StatusRow, changes: Record<string, unknown>): Promise<void> {
  await trx('studies').where({ id: row.id }).update({ ...changes, status_version: row.status_version + 1, updated_at: trx.fn.now() })
}

function audit(trx: Trx, user: SessionUser, action: string, id: number, detail: Record<string, unknown>) {
  return writeAudit({ teamId: user.teamId, actorId: user.id, action, targetType: 'study', targetId: id, detail }, trx)
}

/** Draft → in review, naming team architects other than the owner; one mail per reviewer. */
export async function requestReview(trx: Trx, user: SessionUser, id: number, body: ReviewRequest): Promise<void> {
  const row = await lockStudyStatus(trx, user, id, body.statusVersion)
  if (row.owner_id !== user.id && !mayActOnAny(user)) throw refuse('Only the study\'s owner, an architect or an admin can ask for review')
  requireStatus(row, 'asking for review', 'draft')
  if (row.version < 1) throw invalidField('version', 'save a revision before asking for review')
  const eligible = await eligibleReviewers(trx, user.teamId, row.owner_id)
  const reviewers = body.reviewerIds.map(rid => eligible.find(e => e.id === rid))
  const bad = body.reviewerIds.find((_, i) => !reviewers[i])
  if (bad !== undefined) throw invalidField('reviewerIds', `must be architects of your team other than the study's owner (${bad} is not)`)
  const round = await currentRound(trx, id) + 1
  await trx('study_reviews').insert(body.reviewerIds.map(rid => ({ study_id: id, round, kind: 'assigned', reviewer_id: rid, revision_number: row.version, created_by: user.id })))
  await moveStatus(trx, row, { status: 'in_review' })
  for (const r of reviewers) {
    const mail = reviewRequestMail({ reviewerName: r!.name, requesterName: user.name, studyTitle: row.title, revision: row.version, url: studyUrl(id) })
    await queueMail(trx, { ...mail, teamId: user.teamId, to: r!.email, template: 'review_request' })
  }
  await audit(trx, user, 'study.review_requested', id, { round, revision: row.version, reviewerIds: body.reviewerIds })
}

/** A named reviewer (an architect, not the owner) signs off the current revision or sends the study back to Draft. */
export async function giveVerdict(trx: Trx, user: SessionUser, id: number, body: ReviewVerdict): Promise<number> {
  const row = await lockStudyStatus(trx, user, id, body.statusVersion)
  if (user.role !== 'architect') throw refuse('Only architects sign off or request changes')
  if (row.owner_id === user.id) throw refuse('You own this study: another architect has to review it')
  requireStatus(row, body.verdict === 'signed_off' ? 'signing off' : 'requesting changes', 'in_review')
  const round = await currentRound(trx, id)
  if (!(await roundReviewers(trx, id, round)).some(r => r.id === user.id)) throw refuse('You were not named as a reviewer of this study')
  const [entryId] = await trx('study_reviews').insert({
    study_id: id, round, kind: body.verdict, reviewer_id: user.id, revision_number: row.version, comment: body.comment || null, created_by: user.id
  })
  if (body.verdict === 'changes_requested') await moveStatus(trx, row, { status: 'draft' })
  else await moveStatus(trx, row, {})
  await audit(trx, user, body.verdict === 'signed_off' ? 'study.signed_off' : 'study.changes_requested', id, { round, revision: row.version, reviewId: entryId, comment: body.comment ?? null })
  return entryId!
}

async function checkDecisionBasis(trx: Trx, row: StatusRow, body: DecisionCreate): Promise<DecisionResults> {
  if (body.revision !== row.version) throw invalidField('revision', `must be the current revision (${row.version})`)
  const revision = await trx('study_revisions').where({ study_id: row.id, number: row.version }).first('results')
  const results = revision?.results ? json(revision.results) as DecisionResults : null
  if (!results) throw invalidField('revision', `revision ${row.version} has no saved results; save one with a Monte Carlo run first`)
  const ids = (results.candidates ?? []).map(c => c.id)
  if (!ids.includes(body.candidateId)) throw invalidField('candidateId', `must be one of the revision's candidates: ${ids.join(', ')}`)
  const signOffs = await trx('study_reviews').where({ study_id: row.id, kind: 'signed_off', revision_number: row.version }).whereIn('id', body.signOffIds).select('id')
  if (signOffs.length !== new Set(body.signOffIds).size) {
    throw invalidField('signOffIds', `must be sign-offs of this study on revision ${row.version}`)
  }
  return results
}

/**
 * One waiver per line the chosen candidate fails (and none for a line it does not fail): a field-
 * named 400 otherwise. Returns the waivers with each line's words, as recorded.
 */
export function checkWaivers(results: Parameters<typeof failingLines>[0], body: DecisionCreate): WaiverDto[] {
  const lines = failingLines(results, body.candidateId)
  const given = new Map(body.waivers.map(w => [w.line, w]))
  body.waivers.forEach((w, i) => {
    if (!lines.some(l => l.key === w.line)) {
      throw invalidField(`waivers.${i}.line`, `"${w.line}" is not a line ${body.candidateId} fails${lines.length ? ` (it fails: ${lines.map(l => l.key).join(', ')})` : ' (it meets every line)'}`)
    }
  })
  const missing = lines.filter(l => !given.has(l.key))
  if (missing.length) {
    throw invalidField('waivers', `${body.candidateId} fails ${missing.map(l => `${l.label} (${l.key})`).join(', ')}; deciding on it needs a waiver for each failing line: who accepts it and why`)
  }
  return lines.map(l => ({ line: l.key, label: l.label, by: given.get(l.key)!.by, reason: given.get(l.key)!.reason }))
}

/** In review → decided: the chosen candidate, why, the revision and the sign-offs it rests on, the waivers of what it fails; mails the owner and reviewers. */
export async function decide(trx: Trx, user: SessionUser, id: number, body: DecisionCreate): Promise<number> {
  const row = await lockStudyStatus(trx, user, id, body.statusVersion)
  requireStatus(row, 'recording a decision', 'in_review')
  const results = await checkDecisionBasis(trx, row, body)
  const waivers = checkWaivers(results, body)
  // The portfolio's area, failing findings and name now describe the chosen candidate.
  const chosen = portfolioSummary(results, body.candidateId)
  const candidate = results.candidates!.find(c => c.id === body.candidateId)! as EvaluateCandidate
  const [decisionId] = await trx('study_decisions').insert({
    study_id: id, candidate_id: body.candidateId, rationale: body.rationale, revision_number: row.version,
    sign_off_ids: JSON.stringify([...new Set(body.signOffIds)]), waivers: JSON.stringify(waivers), decided_by: user.id
  })
  await moveStatus(trx, row, { status: 'decided', decision_candidate_id: body.candidateId, summary_area_mm2: chosen.areaMm2, summary_fail_count: chosen.failCount, summary_label: candidateLabel(candidate) })
  const owner = await trx('users').where({ id: row.owner_id }).first('id', 'display_name as name', 'email')
  const recipients = new Map([owner, ...await roundReviewers(trx, id, await currentRound(trx, id))].map(p => [p.id, p]))
  for (const p of recipients.values()) {
    const mail = decisionMail({ recipientName: p.name, deciderName: user.name, studyTitle: row.title, revision: row.version, candidate: `${candidateLabel(candidate)} (${body.candidateId})`, rationale: body.rationale, url: studyUrl(id, true), waivers })
    await queueMail(trx, { ...mail, teamId: user.teamId, to: p.email, template: 'decision' })
  }
  await audit(trx, user, 'study.decided', id, { decisionId, revision: row.version, candidateId: body.candidateId, signOffIds: body.signOffIds, waivers: waivers.map(w => w.line) })
  return decisionId!
}

/** Decided → draft: the decision is kept (superseded) and a new revision copies the decided one. */
export async function reopen(trx: Trx, user: SessionUser, id: number, statusVersion: number): Promise<number> {
  const row = await lockStudyStatus(trx, user, id, statusVersion)
  requireStatus(row, 'reopening', 'decided')
  const decided = await trx('study_revisions').where({ study_id: id, number: row.version }).first()
  const next = row.version + 1
  // The decided revision's inputs, results and ranking weights, written like any revision.
  await writeRevision(trx, {
    studyId: id, number: next, inputs: { spec: json(decided.spec), process: json(decided.process), options: json(decided.options) },
    results: decided.results === null ? null : json(decided.results), weights: decided.weights === null ? null : json(decided.weights),
    engineVersion: decided.engine_version, evaluationId: decided.evaluation_id, note: `Reopened after the decision on revision ${row.version}`, authorId: user.id
  })
  await trx('study_decisions').where({ study_id: id }).whereNull('superseded_at').update({ superseded_at: trx.fn.now() })
  await moveStatus(trx, row, { status: 'draft', decision_candidate_id: null })
  await audit(trx, user, 'study.reopened', id, { fromRevision: row.version, revision: next })
  return next
}

/** Decided → archived. */
export async function archive(trx: Trx, user: SessionUser, id: number, statusVersion: number): Promise<void> {
  const row = await lockStudyStatus(trx, user, id, statusVersion)
  requireStatus(row, 'archiving', 'decided')
  await moveStatus(trx, row, { status: 'archived' })
  await audit(trx, user, 'study.archived', id, { revision: row.version })
}
