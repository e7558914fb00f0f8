import type { Knex } from 'knex'
import type { EvaluateCandidate } from '#shared/core/contract/evaluate'
import { FORMATS } from '#shared/findings/format'
import type { SessionUser } from '#shared/types/auth'
import type { BriefDto, BriefLine } from '#shared/types/brief'
import type { WaiverDto } from '#shared/types/review'
import { subjectFailFindings } from '#shared/utils/recommendation'
import type { StoredRecommendation } from '#shared/utils/recommendation'
import { candidateLabel } from '../../utils/candidateLabel'
import { openNoteThreads } from './noteThreads'

const json = (v: unknown) => typeof v === 'string' ? JSON.parse(v) : v
const f = (name: string, v: unknown) => FORMATS[name]!(v)
const SEVERITY_RANK: Record<string, number> = { fail: 0, warn: 1, advice: 2, note: 3 }

export const BRIEF_CAUTION = 'The numbers come from first-order models (matching, settling, glitch and noise estimates) meant to rank architectures; they are not sign-off simulations. The team\'s review and the transistor-level checks govern.'

interface Spec { bits: number, vrefV: number, updateRateHz: number, loadCapacitanceF: number, loadResistanceOhm?: number | null, inlTargetLsb: number, dnlTargetLsb: number, yieldTarget: number, monotonicRequired?: boolean, areaBudgetMm2: number, glitchLimitVs: number, powerBudgetW: number }
interface Results { candidates: EvaluateCandidate[], recommendedId?: string | null, recommendation?: { candidateId: string | null, reasons: string[] }, findings?: { candidateId: string, severity: string, title: string }[] }

/** The spec in sentences a program manager reads. */
export function specInWords(s: Spec): string[] {
  const load = `${f('f', s.loadCapacitanceF)}${s.loadResistanceOhm ? ` and ${f('ohm', s.loadResistanceOhm)}` : ''}`
  return [
    `${[8, 11, 18].includes(s.bits) ? 'An' : 'A'} ${s.bits}-bit DAC from a ${f('v', s.vrefV)} reference, updating at ${f('hz', s.updateRateHz)} into ${load}.`,
    `Accuracy: INL within ±${f('lsb', s.inlTargetLsb)} and DNL within ±${f('lsb', s.dnlTargetLsb)}, met by ${f('yield', s.yieldTarget)} of parts${s.monotonicRequired ? ', monotonic' : ''}.`,
    `Budgets: area up to ${f('mm2', s.areaBudgetMm2)}, glitch up to ${f('vs', s.glitchLimitVs)}, reference power up to ${f('w', s.powerBudgetW)}.`
  ]
}

/** The subject's spec lines; the verdict is the engine's (`failing`, and `unsettled` for a yield whose interval holds the target). */
function lines(c: EvaluateCandidate, s: Spec): BriefLine[] {
  const m = c.metrics as Record<string, number | null>
  const unsettled = ((c as { unsettled?: string[] }).unsettled ?? []).length > 0
  const line = (label: string, value: number | null, target: number, fmt: string, fails: boolean, atMost = true): BriefLine => ({
    label, value: f(fmt, value), target: `${atMost ? 'up to ' : 'at least '}${f(fmt, target)}`,
    meets: value === null ? null : !fails, ...(label === 'Yield' && unsettled && !fails ? { meets: null, unsettled: true } : {})
  })
  const failing = new Set(c.failing)
  return [
    line('Area', m.totalAreaMm2 ?? null, s.areaBudgetMm2, 'mm2', failing.has('area')),
    line('Yield', m.yield ?? null, s.yieldTarget, 'yield', failing.has('yield') || failing.has('monotonic'), false),
    line('Worst glitch', m.glitchWorstVs ?? null, s.glitchLimitVs, 'vs', failing.has('glitch')),
    line('Reference power', m.refPowerMaxW ?? null, s.powerBudgetW, 'w', failing.has('power'))
  ]
}

async function loadParts(db: Knex, user: SessionUser, id: number) {
  const study = await teamStudies(db, user.teamId).where('s.id', id).first()
  if (!study) throw notFound()
  const head = study.version > 0 ? await db('study_revisions').where({ study_id: id, number: study.version }).first('spec', 'results', 'recommendation') : null
  const decision = await db('study_decisions as d').join('users as u', 'u.id', 'd.decided_by').where('d.study_id', id).whereNull('d.superseded_at')
    .orderBy('d.id', 'desc').first('d.candidate_id', 'd.rationale', 'd.revision_number', 'd.sign_off_ids', 'd.waivers', 'u.display_name', 'd.created_at')
  const signOffs = await db('study_reviews as r').join('users as u', 'u.id', 'r.reviewer_id').where({ 'r.study_id': id, 'r.kind': 'signed_off', 'r.revision_number': study.version })
    .orderBy('r.id').select('u.display_name', 'r.revision_number', 'r.created_at', 'r.comment')
  const counted = await openNoteThreads(db).where('notes.study_id', id).count({ n: '*' }).first()
  const openNotes = Number(counted?.n ?? 0)
  return { study: toStudyDto(study), spec: (head ? json(head.spec) : json(study.spec)) as Spec, results: (head?.results ? json(head.results) : null) as Results | null, stored: (head?.recommendation ? json(head.recommendation) : null) as StoredRecommendation | null, decision, signOffs, openNotes }
}

/** The brief of a study of the caller's team (404 otherwise). */
export async function studyBrief(db: Knex, user: SessionUser, id: number): Promise<BriefDto> {
  const { study, spec, results, stored, decision, signOffs, openNotes } = await loadParts(db, user, id)
  const byId = (cid: string | null | undefined) => (cid ? results?.candidates.find(c => c.id === cid) : undefined)
  const label = (cid: string) => {
    const c = byId(cid)
    return c ? candidateLabel(c) : cid
  }
  // The revision's one recommendation (ranked with its weights when it was written); older rows fall back to the results'.
  const recId = results ? (stored ? stored.candidateId : results.recommendation?.candidateId ?? results.recommendedId ?? null) : null
  const subjectId = decision?.candidate_id ?? recId
  const subject = byId(subjectId)
  const findings = (results?.findings ?? []).filter(x => !subject || x.candidateId === subject.id)
    .sort((a, b) => (SEVERITY_RANK[a.severity] ?? 9) - (SEVERITY_RANK[b.severity] ?? 9))
  return {
    study: { id: study.id, title: study.title, blockName: study.blockName, owner: study.owner.name, status: study.status, revision: study.version },
    asked: specInWords(spec),
    evaluated: results !== null,
    decision: decision
      ? { candidateId: decision.candidate_id, label: label(decision.candidate_id), rationale: decision.rationale, decidedBy: decision.display_name, decidedAt: new Date(decision.created_at).toISOString(), revision: decision.revision_number, waivers: (decision.waivers ? json(decision.waivers) : []) as WaiverDto[] }
      : null,
    recommendation: recId ? { candidateId: recId, label: label(recId), reasons: stored?.reasons ?? results?.recommendation?.reasons ?? [] } : null,
    subject: subject ? { candidateId: subject.id, label: candidateLabel(subject), basis: decision ? 'decision' : 'recommendation', lines: lines(subject, spec) } : null,
    topFindings: findings.slice(0, 3).map(x => ({ severity: x.severity, title: x.title, label: label(x.candidateId) })),
    open: { unresolved: findings.filter(x => x.severity === 'fail' || x.severity === 'warn').map(x => ({ severity: x.severity, title: x.title })), openNotes },
    // counted as the portfolio counts them (subjectFailFindings: the chosen, else the recommended candidate)
    failCount: results ? subjectFailFindings(results.findings, subject?.id ?? null).length : null,
    signOffs: signOffs.map(s => ({ name: s.display_name, revision: s.revision_number, at: new Date(s.created_at).toISOString(), comment: s.comment })),
    caution: BRIEF_CAUTION,
    generatedAt: new Date().toISOString()
  }
}
