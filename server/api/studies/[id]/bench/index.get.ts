import { idParamSchema } from '#shared/schemas/study'
import type { BenchMeasurementDto } from '#shared/types/bench'

/** The study's bench measurements, newest first (every role of the team). */
export default defineApiHandler(async (event): Promise<BenchMeasurementDto[]> => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const db = useDb()
  await teamStudyRow(db, user.teamId, id)
  return (await benchRows(db, id).orderBy('b.id', 'desc').limit(200)).map(toBenchDto)
})
