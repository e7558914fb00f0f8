import { ENGINE_VERSION } from '#shared/core/version'
import { DEFAULT_WEIGHTS } from '#shared/findings/weights'
import { revisionCreateSchema } from '#shared/schemas/revisions'
import { idParamSchema } from '#shared/schemas/study'
import { STUDY_EDITOR_ROLES } from '#shared/types/auth'
import type { RevisionDto } from '#shared/types/revisions'
import { writeRevision } from '../../../../db/writeRevision'

/**
 * Saves the next immutable revision of a study in one transaction. 409 (with the current version
 * in `data.currentVersion`) when `baseVersion` is not the study's version: someone saved first.
 * The ranking weights are kept with the revision (the defaults when the body has none), and results
 * are ranked with them: the revision stores the study's one recommendation (writeRevision).
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
    await writeRevision(trx, {
      studyId: id, number: next, inputs, results: evaluated?.results ?? null, weights: body.weights ?? DEFAULT_WEIGHTS,
      engineVersion: evaluated?.engineVersion ?? ENGINE_VERSION, evaluationId: body.evaluationId ?? null, note: body.note || null, authorId: user.id
    })
    await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'revision_saved', targetType: 'study', targetId: id, detail: { number: next, withResults: Boolean(evaluated) } }, trx)
    return await studyRevisions(trx, id, true).where('r.number', next).first()
  })
  setResponseStatus(event, 201)
  return toRevisionDto(row)
})
