import { netlistSpecInputSchema } from '#shared/core/contract/netlist'
import { exportNetlist } from '#shared/core/netlist/export'
import { netlistCandidateOf } from '#shared/io/candidateId'
import { netlistQuerySchema } from '#shared/schemas/io'
import { idParamSchema } from '#shared/schemas/study'

/** Largest netlist served (a 14-bit string is about 10 MB, a 16-bit one about 43 MB). */
const MAX_NETLIST_BYTES = 16 * 2 ** 20

/**
 * A candidate of the study's current revision as a SPICE netlist file: nominal, or one Monte
 * Carlo sample when `seed` and `index` are given (the engine's netlist export, POST /api/netlist).
 */
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = paramsAs(event, idParamSchema)
  const q = queryAs(event, netlistQuerySchema)
  const { study, head } = await studyWithHead(useDb(), user.teamId, id)
  if (!head) throw studyNotReady('the study has no saved revision yet; save revision 1 to download a netlist')
  const candidate = netlistCandidateOf(q.candidate, head.spec.bits)
  if (!candidate) {
    const message = `candidate: "${q.candidate}" is not a candidate of a ${head.spec.bits}-bit study (string-direct, string-tree, r2r-voltage, r2r-current, segmented-m1 … segmented-m${head.spec.bits - 1}, two-stage-buffered, two-stage-unbuffered)`
    throw createError({ statusCode: 400, statusMessage: MESSAGES.invalidInput, message, data: { message, issues: [{ path: 'candidate', message }] } })
  }
  if ((q.seed === undefined) !== (q.index === undefined)) {
    const message = 'seed: give both seed and index for a Monte Carlo sample, or neither for the nominal circuit'
    throw createError({ statusCode: 400, statusMessage: MESSAGES.invalidInput, message, data: { message, issues: [{ path: q.seed === undefined ? 'seed' : 'index', message }] } })
  }
  const sample = q.seed === undefined ? null : { seed: q.seed, index: q.index! }
  const input = netlistSpecInputSchema.parse({ spec: head.spec, process: head.process, candidate, sample, note: `study ${study.id} revision ${head.number}`, deck: q.deck })
  const out = exportNetlist(input)
  const bytes = Buffer.byteLength(out.netlist)
  if (bytes > MAX_NETLIST_BYTES) {
    const message = `the netlist of ${q.candidate} at ${head.spec.bits} bits is ${(bytes / 2 ** 20).toFixed(1)} MB, above the ${MAX_NETLIST_BYTES / 2 ** 20} MB download limit; the command line writes it: npm run cli -- netlist`
    throw createError({ statusCode: 413, statusMessage: 'Netlist too large', message, data: { message } })
  }
  sendAttachment(event, 'text/plain; charset=utf-8', `${study.title}-${q.candidate}-${sample ? `seed${sample.seed}-index${sample.index}` : 'nominal'}${q.deck === 'portable' ? '-portable' : ''}.cir`)
  return out.netlist
})
