import { ENGINE_VERSION } from '#shared/core/version'
import { importBodySchema } from '#shared/schemas/io'
import { importIsValid, readSpecImport } from '#shared/io/specImport'
import { STUDY_EDITOR_ROLES } from '#shared/types/auth'

/**
 * Creates one study per row (or the study of a study document) with its first inputs-only
 * revision, all in one transaction: any bad row and nothing is created.
 */
export default defineApiHandler(async (event): Promise<{ studies: { id: number, title: string }[], resultsDropped: string | null }> => {
  const user = await requireUser(event, ...STUDY_EDITOR_ROLES)
  const body = await readBodyAs(event, importBodySchema)
  const preview = readSpecImport(body.text, body.format)
  if (!importIsValid(preview)) throw importRefused(preview)
  const source = body.fileName ? `Imported from ${body.fileName}` : 'Imported'
  const studies = await useDb().transaction(async (trx) => {
    const created: { id: number, title: string }[] = []
    for (const row of preview.rows) {
      const revisions = preview.document?.revisions ?? [{ note: null, inputs: row.inputs!, engineVersion: ENGINE_VERSION }]
      const results = preview.document?.results ?? null
      const head = revisions.length
      const [studyId] = await trx('studies').insert({
        team_id: user.teamId, owner_id: user.id, title: row.title, block_name: row.blockName, spec: JSON.stringify(row.inputs!.spec), version: head,
        ...(results ? summaryColumns(results.output) : {})
      })
      await trx('study_revisions').insert(revisions.map((r, i) => ({
        study_id: studyId, number: i + 1, spec: JSON.stringify(r.inputs.spec), process: JSON.stringify(r.inputs.process), options: JSON.stringify(r.inputs.options),
        engine_version: i + 1 === head && results ? results.engineVersion : r.engineVersion,
        results: i + 1 === head && results ? JSON.stringify(results.output) : null,
        note: preview.document ? r.note : source.slice(0, 500), author_id: user.id
      })))
      await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'study_imported', targetType: 'study', targetId: studyId!, detail: { source: body.fileName ?? null, line: row.line, revisions: head } }, trx)
      created.push({ id: studyId!, title: row.title })
    }
    return created
  })
  setResponseStatus(event, 201)
  return { studies, resultsDropped: preview.document?.resultsDropped ?? null }
})
