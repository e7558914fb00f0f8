/**
 * Per-candidate context shared by every evaluation task: the shape, its switch design, the
 * sizing, the fast yields and the Monte Carlo sampling parameters, all derived deterministically
 * from the parsed input, so a worker rebuilds exactly what the planner saw. Building a context
 * runs the switch-design search and the sampled sizing (tens of milliseconds for a large sweep),
 * so contexts are remembered per input and candidate within a thread.
 */
import type { CircuitShape } from '../circuits/types'
import type { EvaluateInput } from '../contract/evaluate'
import type { SamplerParams } from '../models/samplers'
import { createSampler } from '../models/samplers'
import type { CandidateShape } from '../models/shapes'
import { candidateShapes, coarseToFineRatio } from '../models/shapes'
import type { SampledSigmas, SizingProcess, SizingSpec, UnitSizing } from '../models/sizing'
import { chooseUnitOhm, sizeUnit } from '../models/sizing'
import type { CandidateDesign } from './design'
import { chooseDesign } from './design'
import { closedFormYields } from './fast-closed-form'
import type { FastYields, SampledSizing } from './sampled-sizing'
import { SAMPLED_MAX_NORMALS, fastYields, nominalErrors, sampleSizing, sizingTrials } from './sampled-sizing'

/** How a candidate's fast yields and sizing were found. */
export interface FastFigures {
  /** 'sampled': the candidate's own sample; 'bridge-sample': INL from a scaled reference bridge, DNL closed form; 'closed-form' */
  model: 'sampled' | 'bridge-sample' | 'closed-form'
  /** circuits in the sizing sample (0 for closed forms) */
  trials: number
  yields: FastYields
  /** false when no unit size meets the yield target (the nominal error alone is too large) */
  feasible: boolean
}

/** Everything a task needs about one candidate. */
export interface CandidateContext {
  shape: CandidateShape
  design: CandidateDesign | null
  sizing: UnitSizing
  sampler: SamplerParams
  fast: FastFigures
  /** the sizing sample's critical σ's (sampled candidates only; not part of any output) */
  sampled: SampledSizing | null
  /** the spec the sizing read (closed forms: targets less the nominal error), for explain mode */
  sizingSpec: SizingSpec
  /** bridge-sample candidates: the scaled reference bridge's critical σ's for the INL target */
  bridge: Float64Array | null
  /** the σ's the sizing took from a sample (undefined: closed forms), for explain mode */
  sizingGiven?: SampledSigmas
}

/** Sizing view of the input (defaults already applied by the schema). */
export function sizingInputs(input: EvaluateInput): { spec: SizingSpec, process: SizingProcess } {
  return { spec: input.spec, process: input.process }
}

function samplerParams(input: EvaluateInput, unitOhm: number, sigmaUnit: number, design: CandidateDesign | null): SamplerParams {
  const { spec, process, options } = input
  return {
    sigmaUnit,
    switchRatio: process.switchOhm / unitOhm,
    twoR: process.twoRConstruction,
    offsetSigma: process.bufferOffsetSigmaV / spec.vrefV,
    def: options.inlDefinition,
    design: design?.values ?? null,
    switchSigma: process.switchMismatchPct / 100
  }
}

/** Builds one candidate's context (no memo). */
function buildContext(shape: CandidateShape, input: EvaluateInput): CandidateContext {
  const { spec, process } = input
  const { unitOhm } = chooseUnitOhm(shape, spec, process)
  const design = chooseDesign(shape, unitOhm, input, samplerParams(input, unitOhm, 0, null))
  const closed = sizeUnit(shape, spec, process)
  const make = (sigma: number) => createSampler(shape, samplerParams(input, unitOhm, sigma, design))
  const probe = make(closed.sigmaRequired)
  if (probe.normals > SAMPLED_MAX_NORMALS) {
    const { sizing, yields, feasible, sizingSpec, bridge, trials, given } = closedFormYields(shape, input, design)
    const model = bridge ? 'bridge-sample' : 'closed-form'
    return { shape, design, sizing, sampler: samplerParams(input, unitOhm, sizing.sigmaUnit, design), fast: { model, trials, yields, feasible }, sampled: null, sizingSpec, bridge, sizingGiven: given }
  }
  // pure: no error without resistor mismatch, so every trial's error scales with σ_u (one pass)
  const nominal = nominalErrors(make(0))
  const randomAtZero = process.switchMismatchPct > 0 || (shape.buffered === true && process.bufferOffsetSigmaV > 0)
  const pure = nominal.inl < 1e-9 * spec.inlTargetLsb && nominal.dnl < 1e-9 * spec.dnlTargetLsb && !randomAtZero
  const trials = sizingTrials(probe.normals * (shape.topology === 'two-stage-string' ? 8 : 1))
  const sampled = sampleSizing({ stream: streamOf(shape, input), sampler: make, startSigma: closed.sigmaRequired, pure, randomAtZero, trials,
    refine: randomAtZero || Math.max(nominal.inl / spec.inlTargetLsb, nominal.dnl / spec.dnlTargetLsb) >= 0.05 }, {
    inlTargetLsb: spec.inlTargetLsb, dnlTargetLsb: spec.dnlTargetLsb, monotonicRequired: spec.monotonicRequired, yieldTarget: spec.yieldTarget
  })
  const feasible = sampled.sigmaForAll > 0
  const sizing = feasible ? sizeUnit(shape, spec, process, undefined, sampled) : closed
  return {
    shape, design, sizing,
    sampler: samplerParams(input, unitOhm, sizing.sigmaUnit, design),
    fast: { model: 'sampled', trials: sampled.trials, yields: fastYields(sampled.crit, sizing.sigmaUnit), feasible },
    sampled: feasible ? sampled : null,
    sizingSpec: spec,
    bridge: null,
    sizingGiven: feasible ? sampled : undefined
  }
}

/** The sample a candidate is sized on: direct and tree strings are the same circuit. */
function streamOf(s: CandidateShape, input: EvaluateInput): string {
  return [s.topology === 'string' ? 'string' : s.id, input.options.inlDefinition, input.process.twoRConstruction].join(':')
}

const MEMO_LIMIT = 64
const memo = new Map<string, CandidateContext>()

function inputKey(input: EvaluateInput): string {
  const o = input.options
  return JSON.stringify([input.spec, input.process, o.inlDefinition, o.switchHandling, o.switchScale])
}

/** The context of one candidate of the input (remembered per input and candidate). */
export function candidateContext(shape: CandidateShape, input: EvaluateInput): CandidateContext {
  const key = `${shape.id}|${inputKey(input)}`
  const hit = memo.get(key)
  if (hit) return hit
  const c = buildContext(shape, input)
  if (memo.size >= MEMO_LIMIT) memo.delete(memo.keys().next().value!)
  memo.set(key, c)
  return c
}

/** Contexts of every candidate of the input, in output order. */
export function candidateContexts(input: EvaluateInput): CandidateContext[] {
  return candidateShapes(input.spec.bits, input.options.topologies).map(s => candidateContext(s, input))
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
