import { noteCreateSchema } from '#shared/schemas/notes'
import { idParamSchema } from '#shared/schemas/study'
import type { NoteDto } from '#shared/types/notes'

function badField(path: string, rule: string) {
  const message = `${path}: ${rule}`
  return createError({ statusCode: 400, statusMessage: MESSAGES.invalidInput, message, data: { message, issues: [{ path, message: rule }] } })
}

/**
 * Writes a note (every role may annotate): a new thread anchored to the study, a candidate or a
 * candidate's metric, or a reply to a thread. The revision and, for a metric, its value in the head
 * revision are kept with it; mentions queue their e-mails in the same transaction.
 */
export default defineApiHandler(async (event): Promise<NoteDto> => {
  const user = await requireUser(event)
  const { id: studyId } = paramsAs(event, idParamSchema)
  const body = await readBodyAs(event, noteCreateSchema)
  const db = useDb()
  const noteId = await db.transaction(async (trx) => {
    const study = await teamStudyRow(trx, user.teamId, studyId)
    let anchor = body.anchor ?? { type: 'study' as const }
    if (body.parentId !== undefined) {
      const parent = await trx('notes').where({ id: body.parentId, team_id: user.teamId, study_id: studyId }).whereNull('deleted_at').first('parent_id', 'anchor_type', 'candidate_id', 'metric_key')
      if (!parent) throw badField('parentId', 'must be a note of this study that is not deleted')
      if (parent.parent_id !== null) throw badField('parentId', 'must be the first note of a thread (replies are not nested)')
      if (body.anchor) throw badField('anchor', 'a reply takes its thread\'s anchor; leave anchor out')
      anchor = parent.anchor_type === 'study' ? { type: 'study' } : parent.anchor_type === 'candidate' ? { type: 'candidate', candidateId: parent.candidate_id } : { type: 'metric', candidateId: parent.candidate_id, metricKey: parent.metric_key }
    }
    const candidateId = anchor.type === 'study' ? null : anchor.candidateId
    const metricKey = anchor.type === 'metric' ? anchor.metricKey : null
    const head = await headMetrics(trx, studyId)
    const row = {
      team_id: user.teamId, study_id: studyId, parent_id: body.parentId ?? null, anchor_type: anchor.type,
      candidate_id: candidateId, metric_key: metricKey, revision: study.version, metric_value: metricValue(head, candidateId, metricKey),
      body: body.body, body_html: renderNoteMarkdown(body.body), author_id: user.id
    }
    const [id] = await trx('notes').insert(row)
    const mentioned = await mentionAndMail(trx, user, { ...row, id: id! })
    await auditNote(trx, user, 'note.created', { id: id!, study_id: studyId, parent_id: row.parent_id }, { anchor, revision: study.version, mentioned })
    return id!
  })
  setResponseStatus(event, 201)
  return noteById(db, user.teamId, noteId)
})
