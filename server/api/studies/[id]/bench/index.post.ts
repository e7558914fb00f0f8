import { benchSummary, parseBenchCsv } from '#shared/io/benchCsv'
import { netlistCandidateOf } from '#shared/io/candidateId'
import { benchBodySchema } from '#shared/schemas/io'
import { idParamSchema } from '#shared/schemas/study'
import { STUDY_EDITOR_ROLES } from '#shared/types/auth'
import type { BenchMeasurementDto } from '#shared/types/bench'

/**
 * Stores a measured transfer (423 on a decided or archived study, like every other edit) for a candidate of the current revision, with its INL/DNL, only when
 * the whole file is valid; otherwise a 400 on field `text` listing the bad lines (`data.lines`) and nothing stored.
 */
export default defineApiHandler(async (event): Promise<BenchMeasurementDto> => {
  const user = await requireUser(event, ...STUDY_EDITOR_ROLES)
  const { id } = paramsAs(event, idParamSchema)
  const body = await readBodyAs(event, benchBodySchema)
  const db = useDb()
  const { study, head } = await studyWithHead(db, user.teamId, id)
  // Decided and archived studies are read-only except notes (DEVELOPERS.md, Status flow): bench data too.
  assertEditable(study.status)
  if (!head) throw studyNotReady('the study has no saved revision yet; save revision 1, then compare measurements with it')
  const bits = head.spec.bits
  if (!netlistCandidateOf(body.candidateId, bits)) {
    const message = `candidateId: "${body.candidateId}" is not a candidate of a ${bits}-bit study`
    throw createError({ statusCode: 400, statusMessage: MESSAGES.invalidInput, message, data: { message, issues: [{ path: 'candidateId', message }] } })
  }
  const parsed = parseBenchCsv(body.text, bits, body.candidateId === 'r2r-current' ? 'current' : 'voltage')
  if (!parsed.ok) {
    const listed = parsed.errors.map(e => `${e.line === null ? 'file' : `line ${e.line}`}: ${e.message}`)
    // The refused field is the file's text: named first, like every other 400 (issues[0].path).
    const rule = `${body.fileName}: ${parsed.total} problem${parsed.total === 1 ? '' : 's'}, nothing was stored. ${listed.slice(0, 3).join('; ')}`
    const message = `text: ${rule}`
    throw createError({ statusCode: 400, statusMessage: MESSAGES.invalidInput, message, data: { message, issues: [{ path: 'text', message: rule }], lines: parsed.errors, total: parsed.total } })
  }
  const summary = benchSummary(parsed.value.levels)
  const benchId = await db.transaction(async (trx) => {
    assertEditable((await teamStudyRow(trx, user.teamId, id, true)).status)
    const [newId] = await trx('bench_measurements').insert({
      team_id: user.teamId, study_id: id, candidate_id: body.candidateId, revision_number: head.number, uploaded_by: user.id,
      file_name: body.fileName, quantity: parsed.value.quantity, bits, points: JSON.stringify(parsed.value.levels), summary: JSON.stringify(summary)
    })
    await writeAudit({ teamId: user.teamId, actorId: user.id, action: 'bench_uploaded', targetType: 'study', targetId: id, detail: { benchId: newId, candidateId: body.candidateId, fileName: body.fileName } }, trx)
    return newId!
  })
  setResponseStatus(event, 201)
  return toBenchDto(await benchRows(db, id).where('b.id', benchId).first())
})
