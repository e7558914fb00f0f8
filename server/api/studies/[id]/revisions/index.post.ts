import { ENGINE_VERSION } from '#shared/core/version'
import { DEFAULT_WEIGHTS } from '#shared/findings/weights'
import { revisionCreateSchema } from '#shared/schemas/revisions'
import { idParamSchema } from '#shared/schemas/study'
import { STUDY_EDITOR_ROLES } from '#shared/types/auth'
import type { RevisionDto } from '#shared/types/revisions'

/**
 * Saves the next immutable revision of a study in one transaction. 409 (with the current version
 * in `data.currentVersion`) when `baseVersion` is not the study's version: someone saved first.
 * The ranking weights are kept with the revision (the defaults when the body has none).
 * 423 when the study is decided or archived (read-only until reopened); 403 for an engineer who
 * does not own the study.
 */
export default defineApiHandler(async (event): Promise<RevisionDto> => {
  const user = await requireUser(event, ...STUDY_EDITOR_ROLES)
  const { id } = paramsAs(event, idParamSchema)
  const body = await readBodyAs(event, revisionCreateSchema)
  const inputs = { spec: body.spec, process: body.process, options: body.options }
  // The answer is read inside the transaction: a client never gets an error for a saved revision
  // because a second connection was not to be had after the commit.
  const row = await writeTransaction(async (trx) => {
    const study = await teamStudyRow(trx, user.teamId, id, true)
    assertMayEditStudy(user, study)
    assertEditable(study.status)
    if (study.version !== body.baseVersion) {
      throw conflict(`baseVersion: revision ${study.version} was saved after the one you edited (${body.baseVersion}); reload the latest and apply your changes again`, study.version)
    }
    const evaluated = body.evaluationId === undefined ? null : await evaluationResults(trx, user.teamId, body.evaluationId, inputs)
    const next = study.version + 1
    await trx('study_revisions').insert({
      study_id: id, number: next, spec: JSON.stringify(body.spec), process: JSON.stringify(body.process), options: JSON.stringify(body.options),
      engine_version: evaluated?.engineVersion ?? ENGINE_VERSION, results: evaluated ? JSON.stringify(evaluated.results) : null,
      evaluation_id: body.evaluationId ?? null, note: body.note || null, author_id: user.id,
      weights: JSON.stringify(body.weights ?? DEFAULT_WEIGHTS)
    })
    const summary = evaluated ? portfolioSummary(evaluated.results) : null
    await trx('studies').where({ id }).update({
      version: next, spec: JSON.stringify(body.spec), updated_at: trx.fn.now(),
      summary_candidate_id: summary?.candidateId ?? null, summary_area_mm2: summary?.areaMm2 ?? null,
      summary_fail_count: summary?.failCount ?? null, summary_meeting_count: summary?.meetingCount ?? null,
      summary_candidate_count: summary?.candidateCount ?? null
    })
    await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'revision_saved', targetType: 'study', targetId: id, detail: { number: next, withResults: Boolean(evaluated) } }, trx)
    return await studyRevisions(trx, id, true).where('r.number', next).first()
  })
  setResponseStatus(event, 201)
  return toRevisionDto(row)
})
