import type { EvaluateOutput } from '#shared/core/contract/evaluate'
import { ENGINE_VERSION } from '#shared/core/version'
import { importBodySchema } from '#shared/schemas/io'
import { importIsValid, readSpecImport } from '#shared/io/specImport'
import { STUDY_EDITOR_ROLES } from '#shared/types/auth'
import { writeRevision } from '../../../db/writeRevision'

interface ImportAnswer {
  studies: { id: number, title: string }[]
  /** why a document's results were left out, if they were */
  resultsDropped: string | null
  /** set when a document carried results: they were not used, the engine evaluated the head's inputs again */
  resultsRecomputed: string | null
}

/**
 * Creates one study per row (or the study of a study document) with its revisions, all in one
 * transaction: any bad row and nothing is created. A document's results are never stored as they
 * came: the head revision's inputs are evaluated again on the worker pool (the team's rule packs
 * and default weights, like any saved evaluation), so the summary and the portfolio hold only
 * numbers this engine computed for those inputs.
 */
export default defineApiHandler(async (event): Promise<ImportAnswer> => {
  const user = await requireUser(event, ...STUDY_EDITOR_ROLES)
  const body = await readBodyAs(event, importBodySchema)
  const preview = readSpecImport(body.text, body.format)
  if (!importIsValid(preview)) throw importRefused(preview)
  const source = body.fileName ? `Imported from ${body.fileName}` : 'Imported'
  const document = preview.document
  const head = document?.revisions.at(-1)
  let results: EvaluateOutput | null = null
  if (document?.results && head) {
    results = await withHeavySlot(user, 'evaluate', async () => evaluateInPool(head.inputs, { packs: await enabledTeamPacks(user.teamId) }))
  }
  const studies = await useDb().transaction(async (trx) => {
    const created: { id: number, title: string }[] = []
    for (const row of preview.rows) {
      const revisions = document?.revisions ?? [{ note: null, inputs: row.inputs!, engineVersion: ENGINE_VERSION }]
      const [studyId] = await trx('studies').insert({
        team_id: user.teamId, owner_id: user.id, title: row.title, block_name: row.blockName, spec: JSON.stringify(row.inputs!.spec), version: 0
      })
      for (const [i, r] of revisions.entries()) {
        const last = i + 1 === revisions.length
        await writeRevision(trx, {
          studyId: studyId!, number: i + 1, inputs: r.inputs, results: last ? results : null, weights: null,
          engineVersion: last && results ? results.engineVersion : r.engineVersion, note: document ? r.note : source.slice(0, 500), authorId: user.id
        })
      }
      await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'study_imported', targetType: 'study', targetId: studyId!, detail: { source: body.fileName ?? null, line: row.line, revisions: revisions.length, resultsRecomputed: results !== null } }, trx)
      created.push({ id: studyId!, title: row.title })
    }
    return created
  })
  setResponseStatus(event, 201)
  const trials = results?.candidates[0]?.linearity.monteCarlo?.trials ?? 0
  return {
    studies,
    resultsDropped: document?.resultsDropped ?? null,
    resultsRecomputed: results ? `the file's results were not used; the engine evaluated revision ${revisions(document)}'s inputs again (${trials > 0 ? `${trials} Monte Carlo trials` : 'analytic'})` : null
  }
})

function revisions(document: { revisions: unknown[] } | null | undefined): number {
  return document?.revisions.length ?? 1
}
