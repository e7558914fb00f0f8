/**
 * The circuit of a trade-study candidate for netlist export: shape and sizing exactly as the
 * evaluation derives them (unit R, σ_u, switch, 2R construction, two-stage unit ratio), then
 * the circuit builder, nominal or one Monte Carlo sample.
 */
import { buildCircuit } from '../circuits/index'
import type { NetlistSpecInput } from '../contract/netlist'
import type { SolveInput } from '../contract/solve'
import { evaluateOptionsSchema } from '../contract/evaluate'
import { candidateContext, circuitShapeOf, twoStageUnits } from '../evaluation/context'
import type { CandidateShape } from '../models/shapes'
import { twoStageCoarseBits } from '../models/shapes'
import { createNormalSource, deriveSeed } from '../stats/rng'

/** The evaluation's shape of the requested candidate (defaults: direct decode, buffered, M = ⌈N/2⌉). */
export function candidateShapeOf(input: NetlistSpecInput): CandidateShape {
  const c = input.candidate
  const bits = input.spec.bits
  const base = { bits, unaryBits: null, coarseBits: null, decode: null, buffered: null }
  switch (c.topology) {
    case 'string': return { ...base, id: `string-${c.decode ?? 'direct'}`, topology: 'string', decode: c.decode ?? 'direct' }
    case 'r2r-voltage':
    case 'r2r-current': return { ...base, id: c.topology, topology: c.topology }
    case 'segmented': return { ...base, id: `segmented-m${c.unaryBits}`, topology: 'segmented', unaryBits: c.unaryBits ?? 1 }
    case 'two-stage-string': {
      const buffered = c.buffered ?? true
      const coarseBits = c.coarseBits ?? twoStageCoarseBits(bits)
      return { ...base, id: `two-stage-${buffered ? 'buffered' : 'unbuffered'}`, topology: 'two-stage-string', coarseBits, buffered }
    }
  }
}

export interface CandidateCircuit {
  circuit: SolveInput
  shape: CandidateShape
  unitOhm: number
  sigmaUnit: number
  /** ladders and segmented: the switch design the circuit carries (null otherwise) */
  design: { handling: string, scale: number, corner: number } | null
  /** one-line description for the netlist header */
  note: string
}

/**
 * Builds the candidate's circuit exactly as the evaluation designs and sizes it (same context: the
 * switch design at its worst corner, the sampled sizing). `sample: null` gives nominal values;
 * `{ seed, index }` draws one sample from the seeded stream deriveSeed(seed, index) (independent
 * of the evaluation's own Monte Carlo trials, but always the same for the same pair).
 */
export function candidateCircuit(input: NetlistSpecInput): CandidateCircuit {
  const shape = candidateShapeOf(input)
  const { spec, process, sample } = input
  const options = evaluateOptionsSchema.parse(input.options ?? {})
  const c = candidateContext(shape, { spec, process, options })
  const sizing = c.sizing
  const circuit = buildCircuit(circuitShapeOf(shape), {
    unitOhm: sizing.unitOhm,
    vrefV: spec.vrefV,
    switchOhm: process.switchOhm,
    twoR: process.twoRConstruction,
    design: c.design?.values ?? null,
    ...twoStageUnits(shape, sizing.unitOhm),
    ...(sample === null
      ? {}
      : {
          sigmaUnit: sizing.sigmaUnit,
          sigmaOffsetV: process.bufferOffsetSigmaV,
          normal: createNormalSource(deriveSeed(sample.seed, sample.index))
        })
  })
  const what = sample === null ? 'nominal' : `Monte Carlo sample index ${sample.index} of seed ${sample.seed}`
  const d = c.design ? { handling: c.design.chosen.handling, scale: c.design.chosen.scale, corner: c.design.corner } : null
  const how = d ? `; switches ${d.handling}, width ${d.scale}x, at ${(d.corner * 100).toFixed(1)} % of their design value` : ''
  const note = `candidate ${shape.id}, ${what}; unit R = ${sizing.unitOhm} ohm, sigma_u = ${sizing.sigmaUnit}${how}`
  return { circuit, shape, unitOhm: sizing.unitOhm, sigmaUnit: sizing.sigmaUnit, design: d, note }
}
