/**
 * Per-candidate context shared by every evaluation task: the shape, the sizing and the Monte
 * Carlo sampling parameters, all derived deterministically from the parsed input, so a worker
 * rebuilds exactly what the planner saw.
 */
import type { CircuitShape } from '../circuits/types'
import type { EvaluateInput } from '../contract/evaluate'
import type { SamplerParams } from '../models/samplers'
import type { CandidateShape } from '../models/shapes'
import { candidateShapes, coarseToFineRatio } from '../models/shapes'
import type { SizingProcess, SizingSpec, UnitSizing } from '../models/sizing'
import { sizeUnit } from '../models/sizing'

/** Everything a task needs about one candidate. */
export interface CandidateContext {
  shape: CandidateShape
  sizing: UnitSizing
  sampler: SamplerParams
}

/** Sizing view of the input (defaults already applied by the schema). */
export function sizingInputs(input: EvaluateInput): { spec: SizingSpec, process: SizingProcess } {
  return { spec: input.spec, process: input.process }
}

/** Contexts of every candidate of the input, in output order. */
export function candidateContexts(input: EvaluateInput): CandidateContext[] {
  const { spec, process } = input
  return candidateShapes(spec.bits, input.options.topologies).map((shape) => {
    const sizing = sizeUnit(shape, spec, process)
    return {
      shape,
      sizing,
      sampler: {
        sigmaUnit: sizing.sigmaUnit,
        switchRatio: process.switchOhm / sizing.unitOhm,
        twoR: process.twoRConstruction,
        offsetSigma: process.bufferOffsetSigmaV / spec.vrefV,
        def: input.options.inlDefinition
      }
    }
  })
}

/** The circuit-builder shape of a candidate. */
export function circuitShapeOf(s: CandidateShape): CircuitShape {
  switch (s.topology) {
    case 'string': return { topology: 'string', bits: s.bits, decode: s.decode ?? 'direct' }
    case 'r2r-voltage':
    case 'r2r-current': return { topology: s.topology, bits: s.bits }
    case 'segmented': return { topology: 'segmented', bits: s.bits, unaryBits: s.unaryBits ?? 1 }
    case 'two-stage-string': return { topology: 'two-stage-string', bits: s.bits, coarseBits: s.coarseBits ?? 1, buffered: s.buffered === true }
  }
}

/** Coarse and fine unit values (ohms) of a two-stage candidate; undefined for other shapes. */
export function twoStageUnits(s: CandidateShape, unitOhm: number): { coarseUnitOhm?: number, fineUnitOhm?: number } {
  return s.topology === 'two-stage-string' ? { coarseUnitOhm: unitOhm * coarseToFineRatio(s), fineUnitOhm: unitOhm } : {}
}
