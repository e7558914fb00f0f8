/**
 * Contract of `cli solve` / `POST /api/solve`: one circuit with explicit element values (ohms,
 * index 0 = MSB end), solved exactly for every code 0 … 2^N − 1.
 *
 * Supported sizes (the output lists every code, so N is capped at 16 for all topologies):
 * - every topology: `bits` from 2 to 16;
 * - `segmented`: `unaryBits` M from 1 to N − 1 (L = N − M ladder bits);
 * - `two-stage-string`: `coarseBits` M from 1 to N − 1 (L = N − M fine bits);
 * - element values from 1e-6 to 1e15 ohms, `switchOhm` from 0 to 1e15, `vrefV` from 1e-6 to 1e6 V
 *   (every result stays finite; element ratios beyond ~1e12 lose digits to cancellation).
 * Field names are a fixed contract used by scripts: fields may be added, never renamed.
 */
import { z } from 'zod'
import {
  flag, inRange, intInRange, lengthMessage, MAX_OHM, MAX_VOLT, MIN_VREF, ohms, ohmsArray, oneOf, says, strictKeys
} from './fields'

export const MIN_BITS = 2
export const MAX_BITS = 16

export const TOPOLOGIES = ['string', 'r2r-voltage', 'r2r-current', 'segmented', 'two-stage-string'] as const
export type Topology = typeof TOPOLOGIES[number]

const bits = intInRange(MIN_BITS, MAX_BITS)
const common = {
  bits,
  vrefV: inRange(MIN_VREF, MAX_VOLT, 'volts'),
  switchOhm: inRange(0, MAX_OHM, 'ohms').optional()
}

function strict<T extends z.core.$ZodLooseShape>(shape: T) {
  return z.strictObject(shape, strictKeys(Object.keys(shape)))
}

type Ctx = z.core.$RefinementCtx

/** Length checks only make sense once `bits` itself is valid (zod runs refinements anyway). */
function bitsOk(v: { bits: unknown }): boolean {
  return Number.isInteger(v.bits) && (v.bits as number) >= MIN_BITS && (v.bits as number) <= MAX_BITS
}

function expectLength(ctx: Ctx, path: string, values: unknown, expected: number, what: string): void {
  if (Array.isArray(values) && values.length !== expected) {
    ctx.addIssue({ code: 'custom', path: [path], input: values, message: lengthMessage(expected, what, values.length) })
  }
}

const ladderShape = {
  ...common,
  legsOhm: ohmsArray(),
  seriesOhm: ohmsArray(),
  terminationOhm: ohms(),
  /** per-leg switch on-resistance (ohms), MSB first; replaces `switchOhm` for the ladder legs */
  legSwitchOhm: z.array(inRange(0, MAX_OHM, 'ohms'), says('must be a list of on-resistances in ohms')).optional(),
  /** an always-on dummy switch in series with the termination (ohms) */
  terminationSwitchOhm: inRange(0, MAX_OHM, 'ohms').optional()
}

function checkLadder(v: { bits: number, legsOhm: number[], seriesOhm: number[], legSwitchOhm?: number[] }, ctx: Ctx): void {
  if (!bitsOk(v)) return
  expectLength(ctx, 'legsOhm', v.legsOhm, v.bits, 'one leg per bit')
  expectLength(ctx, 'seriesOhm', v.seriesOhm, v.bits - 1, 'bits − 1 series resistors')
  if (v.legSwitchOhm) expectLength(ctx, 'legSwitchOhm', v.legSwitchOhm, v.bits, 'one switch per leg')
}

export const r2rVoltageInputSchema = strict({ topology: z.literal('r2r-voltage'), ...ladderShape })
  .superRefine(checkLadder)

export const r2rCurrentInputSchema = strict({ topology: z.literal('r2r-current'), ...ladderShape })
  .superRefine(checkLadder)

export const stringInputSchema = strict({
  topology: z.literal('string'),
  ...common,
  unitsOhm: ohmsArray(),
  decode: oneOf(['direct', 'tree'] as const).optional()
}).superRefine((v, ctx) => {
  if (bitsOk(v)) expectLength(ctx, 'unitsOhm', v.unitsOhm, 2 ** v.bits, '2^bits unit resistors')
})

export const segmentedInputSchema = strict({
  topology: z.literal('segmented'),
  ...ladderShape,
  unaryBits: intInRange(1, MAX_BITS - 1),
  unaryLegsOhm: ohmsArray(),
  jointOhm: ohms(),
  /** per-unary-leg switch on-resistance (ohms); replaces `switchOhm` for the unary legs */
  unaryLegSwitchOhm: z.array(inRange(0, MAX_OHM, 'ohms'), says('must be a list of on-resistances in ohms')).optional()
}).superRefine((v, ctx) => {
  if (!bitsOk(v) || !Number.isInteger(v.unaryBits)) return
  if (v.unaryBits > v.bits - 1) {
    const message = `must be an integer from 1 to bits − 1 = ${v.bits - 1} (got ${v.unaryBits})`
    ctx.addIssue({ code: 'custom', path: ['unaryBits'], input: v.unaryBits, message })
    return
  }
  const l = v.bits - v.unaryBits
  expectLength(ctx, 'unaryLegsOhm', v.unaryLegsOhm, 2 ** v.unaryBits - 1, '2^unaryBits − 1 unary legs')
  expectLength(ctx, 'legsOhm', v.legsOhm, l, 'one leg per ladder bit (bits − unaryBits)')
  expectLength(ctx, 'seriesOhm', v.seriesOhm, l - 1, 'bits − unaryBits − 1 series resistors')
  if (v.legSwitchOhm) expectLength(ctx, 'legSwitchOhm', v.legSwitchOhm, l, 'one switch per ladder leg')
  if (v.unaryLegSwitchOhm) expectLength(ctx, 'unaryLegSwitchOhm', v.unaryLegSwitchOhm, 2 ** v.unaryBits - 1, 'one switch per unary leg')
})

export const twoStageInputSchema = strict({
  topology: z.literal('two-stage-string'),
  ...common,
  coarseBits: intInRange(1, MAX_BITS - 1),
  coarseOhm: ohmsArray(),
  fineOhm: ohmsArray(),
  buffered: flag(),
  bufferOffsetV: z.tuple([inRange(-MAX_VOLT, MAX_VOLT, 'volts'), inRange(-MAX_VOLT, MAX_VOLT, 'volts')], says('must be a pair [lowV, highV] of volts'))
    .optional()
}).superRefine((v, ctx) => {
  if (v.bufferOffsetV && !v.buffered) {
    ctx.addIssue({ code: 'custom', path: ['bufferOffsetV'], input: v.bufferOffsetV, message: 'is allowed only when buffered is true' })
  }
  if (!bitsOk(v) || !Number.isInteger(v.coarseBits)) return
  if (v.coarseBits > v.bits - 1) {
    const message = `must be an integer from 1 to bits − 1 = ${v.bits - 1} (got ${v.coarseBits})`
    ctx.addIssue({ code: 'custom', path: ['coarseBits'], input: v.coarseBits, message })
    return
  }
  expectLength(ctx, 'coarseOhm', v.coarseOhm, 2 ** v.coarseBits, '2^coarseBits coarse resistors')
  expectLength(ctx, 'fineOhm', v.fineOhm, 2 ** (v.bits - v.coarseBits), '2^(bits − coarseBits) fine resistors')
})

/** Solve input: one circuit, discriminated on `topology`. */
export const solveInputSchema = z.discriminatedUnion('topology', [
  stringInputSchema, r2rVoltageInputSchema, r2rCurrentInputSchema, segmentedInputSchema, twoStageInputSchema
], {
  error: (issue: { code?: string, input?: unknown }) => issue.input === undefined
    ? 'is missing; it must be a circuit object with a topology field'
    : issue.code === 'invalid_union'
      ? `must be one of ${TOPOLOGIES.join(', ')}`
      : 'must be a JSON object with a topology field'
})

export type SolveInput = z.infer<typeof solveInputSchema>
export type StringInput = z.infer<typeof stringInputSchema>
export type R2rVoltageInput = z.infer<typeof r2rVoltageInputSchema>
export type R2rCurrentInput = z.infer<typeof r2rCurrentInputSchema>
export type SegmentedInput = z.infer<typeof segmentedInputSchema>
export type TwoStageInput = z.infer<typeof twoStageInputSchema>

const nullableNumber = z.number().nullable()

/** One code's exact result. `voutV` for voltage-mode topologies, `ioutA` for current mode. */
export const solveCodeSchema = z.object({
  code: z.number().int(),
  voutV: z.number().optional(),
  ioutA: z.number().optional(),
  irefA: z.number(),
  routOhm: nullableNumber
})

/** Solve output: the echo of the circuit size, one entry per code, and a small summary. */
export const solveOutputSchema = z.object({
  topology: z.enum(TOPOLOGIES),
  bits: z.number().int(),
  vrefV: z.number(),
  output: z.enum(['voltage', 'current']),
  codes: z.array(solveCodeSchema),
  summary: z.object({
    irefMinA: z.number(),
    irefMaxA: z.number(),
    rinMinOhm: nullableNumber,
    routMinOhm: nullableNumber,
    routMaxOhm: nullableNumber
  })
})

export type SolveCode = z.infer<typeof solveCodeSchema>
export type SolveOutput = z.infer<typeof solveOutputSchema>
