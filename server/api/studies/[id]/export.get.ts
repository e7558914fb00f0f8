import { idParamSchema } from '#shared/schemas/study'
import { STUDY_DOCUMENT_FORMAT, STUDY_DOCUMENT_VERSION, type StudyDocument } from '#shared/io/studyDocument'

/** The study as a versioned JSON document that imports again as a new study (every role of the team). */
export default defineApiHandler(async (event): Promise<StudyDocument> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const db = useDb()
  const { study, head } = await studyWithHead(db, user.teamId, id)
  const rows = await studyRevisions(db, id, true).orderBy('r.number')
  const revisions = rows.map(toRevisionDto).map(r => ({
    number: r.number, note: r.note, engineVersion: r.engineVersion, createdAt: r.createdAt,
    inputs: { spec: r.spec, process: r.process, options: r.options }
  }))
  if (revisions.length === 0) {
    // Before the first save a study has a spec but no process or options: nothing that imports as a study.
    throw studyNotReady('the study has no saved revision yet; save revision 1 to export it')
  }
  sendAttachment(event, 'application/json; charset=utf-8', `${study.title}.rungwise.json`)
  return {
    format: STUDY_DOCUMENT_FORMAT,
    version: STUDY_DOCUMENT_VERSION,
    exportedAt: new Date().toISOString(),
    engineVersion: head?.results ? head.engineVersion : null,
    study: { id: study.id, title: study.title, blockName: study.blockName, status: study.status },
    revisions,
    results: head?.results ? { revision: head.number, output: head.results } : null
  }
})
