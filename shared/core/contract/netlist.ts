/**
 * Contract of `cli netlist` / `POST /api/netlist`: a SPICE netlist of one circuit, given either
 * - `{ circuit: <solve input> }`: exactly these element values (see solve.ts), or
 * - `{ spec, process, candidate, sample }`: a candidate of a trade study, sized as the
 *   evaluation sizes it (unit R and σ_u), nominal (`sample: null`) or one Monte Carlo sample
 *   (`sample: { seed, index }`, an independent draw reproducible from the pair).
 * Output: `{ netlist, format: 'spice', … }` with the names of the result files the netlist's
 * control block writes and their columns; the candidate form also returns the circuit it built.
 */
import { z } from 'zod'
import { evaluateOptionsSchema, evaluateProcessSchema, evaluateSpecSchema } from './evaluate'
import { flag, intInRange, oneOf, says, strictKeys } from './fields'
import { MAX_BITS, solveInputSchema, TOPOLOGIES } from './solve'

export const MAX_NOTE_CHARS = 200
export const MAX_SAMPLE_INDEX = 1e9

// one comment line of the netlist: no line breaks or control characters (they could start SPICE commands)
const note = z.string(says('must be a string'))
  .max(MAX_NOTE_CHARS, says(`must be a string of at most ${MAX_NOTE_CHARS} characters`))
  .regex(/^[^\p{Cc}]*$/u, says('must be a single line without control characters'))

function strict<T extends z.core.$ZodLooseShape>(shape: T) {
  return z.strictObject(shape, strictKeys(Object.keys(shape)))
}

/** 'ngspice' (default): the deck ngspice runs unchanged; 'portable': elements, sources and sweep only (netlist/portable.ts). */
export const NETLIST_DECKS = ['ngspice', 'portable'] as const
const deck = oneOf(NETLIST_DECKS).optional()

/** `{ circuit }` form: the netlist of exactly these element values. */
export const netlistCircuitInputSchema = strict({
  circuit: solveInputSchema,
  note: note.optional(),
  deck
})

export const netlistCandidateSchema = strict({
  topology: oneOf(TOPOLOGIES),
  /** segmented only: M unary bits, 1 … bits − 1 (required) */
  unaryBits: intInRange(1, MAX_BITS - 1).optional(),
  /** two-stage string only: M coarse bits, 1 … bits − 1 (default ⌈bits/2⌉) */
  coarseBits: intInRange(1, MAX_BITS - 1).optional(),
  /** string only: 'direct' (default) or 'tree' */
  decode: oneOf(['direct', 'tree'] as const).optional(),
  /** two-stage string only: default true */
  buffered: flag().optional()
})

const sampleSchema = z.union([
  z.null(),
  strict({ seed: intInRange(0, 2 ** 32 - 1), index: intInRange(0, MAX_SAMPLE_INDEX) })
], says('must be null (nominal) or { "seed": integer, "index": integer }'))

const ONLY: Record<string, string> = { unaryBits: 'segmented', coarseBits: 'two-stage-string', decode: 'string', buffered: 'two-stage-string' }

/** `{ spec, process, candidate, sample }` form: a sized candidate, nominal or one sample. */
export const netlistSpecInputSchema = strict({
  spec: evaluateSpecSchema,
  process: evaluateProcessSchema,
  candidate: netlistCandidateSchema,
  sample: sampleSchema.default(null),
  note: note.optional(),
  /** the study's evaluate options (INL definition and switch design decide the sizing); evaluate's defaults when absent */
  options: evaluateOptionsSchema.optional(),
  deck
}).superRefine((v, ctx) => {
  const c = v.candidate
  for (const [field, topology] of Object.entries(ONLY)) {
    if (c[field as keyof typeof c] !== undefined && c.topology !== topology) {
      ctx.addIssue({ code: 'custom', path: ['candidate', field], input: c[field as keyof typeof c], message: `is only used by ${topology} candidates` })
    }
  }
  const split = c.topology === 'segmented' ? 'unaryBits' : c.topology === 'two-stage-string' ? 'coarseBits' : null
  const value = split === null ? undefined : c[split]
  if (split === 'unaryBits' && value === undefined) {
    ctx.addIssue({ code: 'custom', path: ['candidate', split], input: value, message: `is missing; it must be an integer from 1 to bits − 1 = ${v.spec.bits - 1}` })
  } else if (split !== null && value !== undefined && value > v.spec.bits - 1) {
    ctx.addIssue({ code: 'custom', path: ['candidate', split], input: value, message: `must be an integer from 1 to bits − 1 = ${v.spec.bits - 1} (got ${value})` })
  }
})

export const netlistInputSchema = z.union([netlistCircuitInputSchema, netlistSpecInputSchema])

export type NetlistInput = z.infer<typeof netlistInputSchema>
export type NetlistSpecInput = z.infer<typeof netlistSpecInputSchema>

export const netlistOutputSchema = z.object({
  netlist: z.string(),
  format: z.literal('spice'),
  topology: z.enum(TOPOLOGIES),
  bits: z.number().int(),
  /** number of element lines */
  elements: z.number().int(),
  /** results file of the DC sweep and its columns after the code column */
  dcFile: z.string(),
  dcColumns: z.array(z.string()),
  /** results file of the output-resistance sweep; column `rout` (ohms) or `gout` (siemens) */
  routFile: z.string(),
  routColumn: z.enum(['rout', 'gout']),
  /** which deck this is; a portable deck writes no files (dcFile and routFile are '') and prints `printColumns` */
  deck: z.enum(NETLIST_DECKS).optional(),
  printColumns: z.array(z.string()).optional(),
  /** candidate form only: the circuit that was built (a solve input) and how it was sized */
  circuit: solveInputSchema.optional(),
  sizing: z.object({ unitOhm: z.number(), sigmaUnit: z.number() }).optional(),
  /** candidate form, ladders and segmented: the switch design the circuit carries */
  design: z.object({ handling: z.string(), scale: z.number(), corner: z.number() }).nullable().optional(),
  sample: z.object({ seed: z.number().int(), index: z.number().int() }).nullable().optional()
})

export type NetlistOutput = z.infer<typeof netlistOutputSchema>
