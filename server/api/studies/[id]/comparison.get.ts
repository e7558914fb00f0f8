import { stringify } from 'csv-stringify/sync'
import { comparisonRows } from '#shared/io/comparisonCsv'
import { idParamSchema } from '#shared/schemas/study'

/**
 * The current revision's candidates and metrics as CSV (every role of the team). Text cells are
 * neutralised as in the portfolio export; numbers are written as they are (a negative number is
 * data, not a formula). The recommended column is the revision's stored recommendation.
 */
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const { study, head } = await studyWithHead(useDb(), user.teamId, id)
  if (!head?.results) {
    throw studyNotReady(head ? `revision ${head.number} has inputs only; run Monte Carlo and save a revision with results to export its comparison` : 'the study has no saved revision yet')
  }
  sendAttachment(event, 'text/csv; charset=utf-8', `${study.title}-revision-${head.number}-comparison.csv`)
  return stringify(comparisonRows({ ...head.results, recommendedId: head.recommendation ? head.recommendation.candidateId : (head.results as { recommendedId?: string | null }).recommendedId }).map(row => row.map(v => (typeof v === 'number' ? String(v) : csvCell(v)))))
})
