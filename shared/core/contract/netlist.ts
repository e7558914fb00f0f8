/**
 * Contract of `cli netlist` / `POST /api/netlist`: a SPICE netlist of one circuit given with
 * explicit element values (`{ circuit: <solve input> }`, see solve.ts).
 * Output: `{ netlist, format: 'spice', … }` with the names of the result files the netlist's
 * control block writes and their columns.
 */
import { z } from 'zod'
import { says, strictKeys } from './fields'
import { solveInputSchema, TOPOLOGIES } from './solve'

export const MAX_NOTE_CHARS = 200

// one comment line of the netlist: no line breaks or control characters (they could start SPICE commands)
const note = z.string(says('must be a string'))
  .max(MAX_NOTE_CHARS, says(`must be a string of at most ${MAX_NOTE_CHARS} characters`))
  .regex(/^[^\p{Cc}]*$/u, says('must be a single line without control characters'))

/** `{ circuit }` form: the netlist of exactly these element values. */
export const netlistCircuitInputSchema = z.strictObject({
  circuit: solveInputSchema,
  note: note.optional()
}, strictKeys(['circuit', 'note']))

export const netlistInputSchema = netlistCircuitInputSchema

export type NetlistInput = z.infer<typeof netlistInputSchema>

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
  routColumn: z.enum(['rout', 'gout'])
})

export type NetlistOutput = z.infer<typeof netlistOutputSchema>
