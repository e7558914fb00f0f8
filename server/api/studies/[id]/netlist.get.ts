import { netlistSpecInputSchema } from '#shared/core/contract/netlist'
import { netlistCandidateOf } from '#shared/io/candidateId'
import { netlistQuerySchema } from '#shared/schemas/io'
import { idParamSchema } from '#shared/schemas/study'

/** Largest netlist served (a 14-bit string is about 10 MB, a 16-bit one about 43 MB). */
const MAX_NETLIST_BYTES = 16 * 2 ** 20
/**
 * Fewest bytes a resistor string's netlist takes per code: measured 546 at 8 bits, rising to 608 at
 * 14 (one resistor, one tap switch and their nodes per code), so 2^N × 500 is a lower bound. Other
 * candidates' netlists are far smaller (an R-2R ladder is kilobytes at 14 bits).
 */
const STRING_BYTES_PER_CODE_AT_LEAST = 500

function tooLarge(candidate: string, bits: number, bytes: number, what: string) {
  const message = `the netlist of ${candidate} at ${bits} bits is ${what ? `${what} ` : ''}${(bytes / 2 ** 20).toFixed(1)} MB, above the ${MAX_NETLIST_BYTES / 2 ** 20} MB download limit; the command line writes it: npm run cli -- netlist`
  return createError({ statusCode: 413, statusMessage: 'Netlist too large', message, data: { message } })
}

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
  const input = netlistSpecInputSchema.parse({ spec: head.spec, process: head.process, options: head.options, candidate, sample, note: `study ${study.id} revision ${head.number}`, deck: q.deck })
  // Refused before anything is built when even the lower bound is over the limit (a 16-bit string);
  // otherwise built on the worker pool under the user's heavy slot, and a file over the limit is
  // refused there, its text never reaching this thread.
  const atLeast = candidate.topology === 'string' ? 2 ** head.spec.bits * STRING_BYTES_PER_CODE_AT_LEAST : 0
  if (atLeast > MAX_NETLIST_BYTES) throw tooLarge(q.candidate, head.spec.bits, atLeast, 'at least')
  const signal = clientGone(event)
  const file = await withHeavySlot(user, 'netlist', () => netlistFileInPool(input, MAX_NETLIST_BYTES, signal))
  if (file.text === null) throw tooLarge(q.candidate, head.spec.bits, file.bytes, '')
  sendAttachment(event, 'text/plain; charset=utf-8', `${study.title}-${q.candidate}-${sample ? `seed${sample.seed}-index${sample.index}` : 'nominal'}${q.deck === 'portable' ? '-portable' : ''}.cir`)
  return file.text
})
