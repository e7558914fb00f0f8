import { netlistSpecInputSchema } from '#shared/core/contract/netlist'
import { benchSummary } from '#shared/io/benchCsv'
import { inlBuckets } from '#shared/io/benchCompare'
import { netlistCandidateOf } from '#shared/io/candidateId'
import { benchParamsSchema } from '#shared/schemas/io'
import type { BenchComparisonDto } from '#shared/types/bench'

/** One measurement beside the nominal prediction and the Monte Carlo envelope of the revision it was compared with. */
export default defineApiHandler(async (event): Promise<BenchComparisonDto> => {
  const user = await requireUser(event)
  const { id, benchId } = paramsAs(event, benchParamsSchema)
  const db = useDb()
  await teamStudyRow(db, user.teamId, id)
  const row = await benchRows(db, id, true).where('b.id', benchId).first()
  if (!row) throw notFound()
  const dto = toBenchDto(row)
  const revision = toRevisionDto(await studyRevisions(db, id, true).where('r.number', dto.revisionNumber).first())
  const levels: number[] = typeof row.points === 'string' ? JSON.parse(row.points) : row.points
  const found = revision.results?.candidates.find(c => c.id === dto.candidateId)
  const mc = (found?.linearity.monteCarlo as { trials: number, envelope?: { codes: number[], inlMinLsb: number[], inlMaxLsb: number[] } } | null | undefined) ?? null
  const definition = revision.options.inlDefinition
  const points = mc?.envelope?.codes.length ?? revision.options.envelopePoints
  const candidate = netlistCandidateOf(dto.candidateId, dto.bits)!
  // The nominal transfer is an exact solve of 2^N codes: on the worker pool, under the user's heavy slot.
  const nominalInput = netlistSpecInputSchema.parse({ spec: revision.spec, process: revision.process, options: revision.options, candidate, sample: null })
  const signal = clientGone(event)
  const nominal = await withHeavySlot(user, 'bench', () => nominalLevelsInPool(nominalInput, signal))
  return {
    ...dto,
    definition,
    measured: inlBuckets(levels, dto.bits, definition, points),
    nominal: inlBuckets(nominal, dto.bits, definition, points),
    predicted: benchSummary(nominal),
    envelope: mc?.envelope ? { codes: mc.envelope.codes, min: mc.envelope.inlMinLsb, max: mc.envelope.inlMaxLsb } : null,
    monteCarloTrials: mc?.trials ?? null
  }
})
