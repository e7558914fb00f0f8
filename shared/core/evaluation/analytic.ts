/**
 * The analytic (non-Monte-Carlo) part of one candidate: counts, sizing and area, analytic σ and
 * yields, the exact nominal solve of every code (systematic INL/DNL, I_REF, R_out), reference,
 * dynamics, glitch of every transition, noise and power. Pure and synchronous; the result is
 * plain data so it can come back from a worker. Given a `trace` (explain mode), every formula and
 * procedure behind a metric records its inputs and result there.
 */
import { buildCircuit } from '../circuits/index'
import type { EvaluateInput } from '../contract/evaluate'
import { traceGlitch } from '../explain/glitch-trace'
import { OUTPUT_FORMULAS as F } from '../explain/registry'
import type { Trace } from '../explain/types'
import { elementCounts } from '../models/counts'
import type { ElementCounts } from '../models/counts'
import { dynamics, effectiveRoutMaxOhm } from '../models/dynamics'
import { analyticDnlYield, analyticInlYield, analyticMonotonicYield, analyticSigmas } from '../models/matching'
import { switchWidthUnits } from '../models/switch-design'
import { ktcNoiseVrms, quantisationNoiseVrms, rcNoiseVrms } from '../models/noise'
import type { ReferenceSummary } from '../models/reference'
import { referenceSummary } from '../models/reference'
import { solveCircuitArrays } from '../solve/index'
import type { DecimatedSeries } from '../stats/envelope'
import { decimateSeries } from '../stats/envelope'
import { dnlAbsLsb, inlAbsLsb, linearityFromLevels, newLinearityResult } from '../stats/linearity'
import type { CandidateContext } from './context'
import { circuitShapeOf, twoStageUnits } from './context'
import type { GlitchSummary } from './glitch-summary'
import { summariseGlitch } from './glitch-summary'
import type { DnlEnvelope } from './series-mc'
import type { NominalCodeSeries } from './series-nominal'
import { nominalCodeSeries } from './series-nominal'
import type { YieldAgainstArea } from './series-yield'

/** Analytic results of one candidate (SI units). */
export interface AnalyticCandidate {
  id: string
  counts: ElementCounts
  area: { resistorAreaMm2: number, switchAreaMm2: number, decoderAreaMm2: number, totalAreaMm2: number, areaBudgetShare: number }
  analytic: { inlSigmaLsb: number, dnlSigmaLsb: number, inlYield: number, dnlYield: number, monotonicYield: number, yield: number }
  systematic: { inlLsb: number, dnlLsb: number, loadedInlLsb: number | null }
  reference: ReferenceSummary
  output: { routMinOhm: number, routMaxOhm: number, routEffMaxOhm: number, tauS: number, settlingS: number, maxUpdateRateHz: number | null }
  noise: { noiseVrms: number, noiseKtcVrms: number | null, quantNoiseVrms: number }
  glitch: GlitchSummary
  series: { irefA: DecimatedSeries, rinOhm: DecimatedSeries, routOhm: DecimatedSeries }
  /** nominal transfer error, INL and DNL per code (series-nominal.ts) */
  perCode: NominalCodeSeries
  /** added by the analytic task (series-mc.ts, series-yield.ts), not by explain mode */
  dnlEnvelope?: DnlEnvelope | null
  yieldAgainstArea?: YieldAgainstArea
}

function areaOf(c: CandidateContext, counts: ElementCounts, input: EvaluateInput, trace?: Trace): AnalyticCandidate['area'] {
  const p = input.process
  const resistorAreaMm2 = F.resistorArea.use({ n_u: counts.unitResistorCount, A_unit: c.sizing.unitAreaUm2, k_ovh: p.layoutOverhead }, trace, 'resistorAreaMm2', { n_u: 'unitResistorCount', A_unit: 'unitAreaUm2' })
  // a designed ladder counts its switches in process-switch widths (wider switches, a dummy)
  const widths = c.design ? switchWidthUnits(c.shape, c.design.values, c.design.chosen.handling) : counts.switchCount
  if (trace && c.design) {
    trace.switchWidthUnits = { kind: 'procedure', procedure: 'switch-design', inputs: { handling: c.design.chosen.handling, scale: c.design.chosen.scale, switchCount: counts.switchCount }, result: widths }
  }
  const switchAreaMm2 = F.switchArea.use({ n_sw: widths, A_sw: p.switchAreaUm2 }, trace, 'switchAreaMm2', { n_sw: c.design ? 'switchWidthUnits' : 'switchCount' })
  const decoderAreaMm2 = F.decoderArea.use({ n_g: counts.decoderGateCount, A_g: p.gateAreaUm2 }, trace, 'decoderAreaMm2', { n_g: 'decoderGateCount' })
  const totalAreaMm2 = F.totalArea.use({ A_res: resistorAreaMm2, A_sw: switchAreaMm2, A_dec: decoderAreaMm2 }, trace, 'totalAreaMm2', { A_res: 'resistorAreaMm2', A_sw: 'switchAreaMm2', A_dec: 'decoderAreaMm2' })
  const areaBudgetShare = F.areaShare.use({ A_total: totalAreaMm2, A_budget: input.spec.areaBudgetMm2 }, trace, 'areaBudgetShare', { A_total: 'totalAreaMm2' })
  return { resistorAreaMm2, switchAreaMm2, decoderAreaMm2, totalAreaMm2, areaBudgetShare }
}

/**
 * σ of the worst INL and DNL by the closed forms (for reading), and the fast yields the context
 * found: on the sizing sample (procedure entries) or by the closed forms (formula entries).
 */
function analyticStats(c: CandidateContext, input: EvaluateInput, trace?: Trace): AnalyticCandidate['analytic'] {
  const { shape, sizing, fast } = c
  const twoR = input.process.twoRConstruction
  const s = input.spec
  if (trace && fast.model !== 'sampled') {
    analyticInlYield(shape, twoR, sizing.sigmaUnit, s.inlTargetLsb, trace)
    analyticDnlYield(shape, twoR, sizing.sigmaUnit, s.dnlTargetLsb, trace)
    analyticMonotonicYield(shape, twoR, sizing.sigmaUnit, trace)
  }
  if (trace) {
    const entry = (key: string, criterion: string, result: number) => {
      const procedure = fast.model === 'closed-form' ? 'closed-form-yield' : fast.model === 'sampled' || criterion === 'INL' ? (fast.model === 'sampled' ? 'sampled-yield' : 'bridge-sample-yield') : 'closed-form-yield'
      trace[key] = { kind: 'procedure', procedure, inputs: { trials: fast.trials, criterion, sigmaUnit: sizing.sigmaUnit }, result }
    }
    entry('inlYieldAnalytic', 'INL', fast.yields.inlYield)
    entry('dnlYieldAnalytic', 'DNL', fast.yields.dnlYield)
    entry('monotonicYieldAnalytic', 'monotonic', fast.yields.monotonicYield)
  }
  return { ...analyticSigmas(shape, twoR, sizing.sigmaUnit, trace), ...fast.yields }
}

/** Procedure entries of the nodal-solve quantities (explain mode only). */
function traceSolved(a: AnalyticCandidate, input: EvaluateInput, trace: Trace): void {
  const def = input.options.inlDefinition
  const solved = (key: string, procedure: string, inputs: Record<string, number | string | null>, result: number | null) => {
    trace[key] = { kind: 'procedure', procedure: result === null ? 'not-applicable' : procedure, inputs, result }
  }
  solved('systematicInlLsb', 'nodal-linearity', { inlDefinition: def }, a.systematic.inlLsb)
  solved('systematicDnlLsb', 'nodal-linearity', { inlDefinition: def }, a.systematic.dnlLsb)
  solved('loadedInlLsb', 'nodal-linearity', { inlDefinition: def, loadResistanceOhm: input.spec.loadResistanceOhm }, a.systematic.loadedInlLsb)
  solved('routMinOhm', 'nodal-solve-extreme', { extreme: 'min' }, a.output.routMinOhm)
  solved('routMaxOhm', 'nodal-solve-extreme', { extreme: 'max' }, a.output.routMaxOhm)
  solved('routEffMaxOhm', 'per-code-max', { loadResistanceOhm: input.spec.loadResistanceOhm }, a.output.routEffMaxOhm)
  if (a.noise.noiseKtcVrms === null) {
    solved('noiseKtcVrms', 'not-applicable', { loadCapacitanceF: input.spec.loadCapacitanceF }, null)
  }
}

/** Levels of a voltage output under a resistive load: V·R_L/(R_L + R_out(k)). */
function loadedInl(value: Float64Array, rout: Float64Array, loadOhm: number, input: EvaluateInput): number {
  const loaded = new Float64Array(value.length)
  for (let k = 0; k < value.length; k++) {
    loaded[k] = (value[k]! * loadOhm) / (loadOhm + rout[k]!)
  }
  return inlAbsLsb(linearityFromLevels(loaded, input.options.inlDefinition, newLinearityResult()))
}

/** R_in(k) = V_REF / I_REF(k) per code (a loop: TypedArray.map's callback per code was a hot spot). */
function inputResistance(irefA: Float64Array, vrefV: number): Float64Array {
  const out = new Float64Array(irefA.length)
  for (let k = 0; k < irefA.length; k++) {
    out[k] = vrefV / irefA[k]!
  }
  return out
}

/** Per-code output resistance driving the load: the I–V amplifier's R_fb = R stands in for current mode. */
function drivingRout(c: CandidateContext, rout: Float64Array): Float64Array {
  return c.shape.topology === 'r2r-current' ? new Float64Array(rout.length).fill(c.sizing.unitOhm) : rout
}

function finiteRange(a: Float64Array): { min: number, max: number } {
  let min = Infinity
  let max = -Infinity
  for (let k = 0; k < a.length; k++) {
    const v = a[k]!
    if (Number.isFinite(v)) {
      min = Math.min(min, v)
      max = Math.max(max, v)
    }
  }
  return { min, max }
}

/** The process as the chosen switches see it: a switch w times wider injects w times the charge. */
function switchedProcess(c: CandidateContext, process: EvaluateInput['process']): EvaluateInput['process'] {
  const w = c.design?.chosen.scale ?? 1
  return w === 1 ? process : { ...process, switchChargeC: process.switchChargeC * w }
}

/** The analytic part of one candidate; a `trace` collects how each metric was computed. */
export function analyseCandidate(c: CandidateContext, input: EvaluateInput, trace?: Trace): AnalyticCandidate {
  const { spec, process, options } = input
  const counts = elementCounts(c.shape, process.twoRConstruction, trace)
  const circuit = buildCircuit(circuitShapeOf(c.shape), {
    unitOhm: c.sizing.unitOhm, vrefV: spec.vrefV, switchOhm: process.switchOhm, twoR: process.twoRConstruction,
    ...twoStageUnits(c.shape, c.sizing.unitOhm), design: c.design?.values ?? null
  })
  const sol = solveCircuitArrays(circuit)
  const nominal = linearityFromLevels(sol.value, options.inlDefinition, newLinearityResult())
  const rout = drivingRout(c, sol.routOhm)
  const voltageOut = sol.output === 'voltage'
  const routEffMaxOhm = effectiveRoutMaxOhm(rout, spec.loadResistanceOhm)
  const routRange = finiteRange(sol.routOhm)
  const vLsb = spec.vrefV / 2 ** spec.bits
  const budget = spec.refInlBudgetLsb ?? 0.1 * spec.inlTargetLsb
  const glitchProcess = switchedProcess(c, process)
  const glitch = summariseGlitch(c.shape, vLsb, rout, glitchProcess, options.envelopePoints)
  const result: AnalyticCandidate = {
    id: c.shape.id,
    counts,
    area: areaOf(c, counts, input, trace),
    analytic: analyticStats(c, input, trace),
    systematic: {
      inlLsb: inlAbsLsb(nominal),
      dnlLsb: dnlAbsLsb(nominal),
      loadedInlLsb: spec.loadResistanceOhm !== null && voltageOut ? loadedInl(sol.value, rout, spec.loadResistanceOhm, input) : null
    },
    reference: referenceSummary(sol.irefA, spec.vrefV, spec.refSourceOhm, budget, options.inlDefinition, trace),
    output: {
      routMinOhm: routRange.min,
      routMaxOhm: routRange.max,
      routEffMaxOhm,
      ...dynamics(routEffMaxOhm, spec.loadCapacitanceF, spec.bits, process.latchDelayS, trace)
    },
    noise: {
      noiseVrms: rcNoiseVrms(routEffMaxOhm, spec.loadCapacitanceF, spec.updateRateHz / 2, spec.temperatureK, trace),
      noiseKtcVrms: spec.loadCapacitanceF > 0 ? ktcNoiseVrms(spec.loadCapacitanceF, spec.temperatureK, trace) : null,
      quantNoiseVrms: quantisationNoiseVrms(spec.vrefV, spec.bits, trace)
    },
    glitch,
    series: {
      irefA: decimateSeries(sol.irefA, options.envelopePoints),
      rinOhm: decimateSeries(inputResistance(sol.irefA, spec.vrefV), options.envelopePoints),
      routOhm: decimateSeries(sol.routOhm, options.envelopePoints)
    },
    perCode: nominalCodeSeries(sol.value, voltageOut ? vLsb : vLsb / c.sizing.unitOhm, options.inlDefinition, options.envelopePoints)
  }
  if (trace) {
    traceSolved(result, input, trace)
    traceGlitch(c.shape, vLsb, rout, glitchProcess, glitch, trace)
  }
  return result
}
