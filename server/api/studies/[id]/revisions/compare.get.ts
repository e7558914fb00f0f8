import { revisionCompareQuerySchema } from '#shared/schemas/revisions'
import { idParamSchema } from '#shared/schemas/study'
import type { RevisionCompareDto } from '#shared/types/revisions'

/** Two revisions side by side: input changes field by field, result changes per candidate metric. */
export default defineApiHandler(async (event): Promise<RevisionCompareDto> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const { from, to } = queryAs(event, revisionCompareQuerySchema)
  const db = useDb()
  await teamStudyRow(db, user.teamId, id)
  const rows = await studyRevisions(db, id, true).whereIn('r.number', [from, to])
  const a = rows.find(r => r.number === from)
  const b = rows.find(r => r.number === to)
  if (!a || !b) throw notFound()
  const [x, y] = [toRevisionDto(a), toRevisionDto(b)]
  return {
    from: toRevisionSummary(a),
    to: toRevisionSummary(b),
    inputs: diffInputs(x, y),
    results: x.results && y.results ? diffResults(x.results, y.results) : null
  }
})
