/**
 * Unit resistor sizing (MODELS.md §4.1, §4.3–4.6): the σ_u the yield target allows, the unit
 * area from the Pelgrom area law (σ_u = A_R,single / √(W·L)), the value-driven minimum
 * (W ≥ W_min, L ≥ L_min at R_unit = R_□·L/W), and the unit resistance when asked to choose it.
 * Every number is computed through the formula registry (explain/formulas/sizing.ts).
 */
import { SIZING_FORMULAS as F } from '../explain/registry'
import type { Trace } from '../explain/types'
import { sigmaForDnl, sigmaForInl } from './matching'
import type { CandidateShape, TwoRConstruction } from './shapes'
import { lowBits } from './shapes'

/** Spec fields sizing needs (SI units). */
export interface SizingSpec {
  bits: number
  vrefV: number
  updateRateHz: number
  loadCapacitanceF: number
  inlTargetLsb: number
  dnlTargetLsb: number
  yieldTarget: number
  powerBudgetW: number
}

/** Process fields sizing needs; `matchingPctUm` is A_R in %·µm under `matchingConvention`. */
export interface SizingProcess {
  sheetOhmPerSq: number
  matchingPctUm: number
  matchingConvention: 'pair' | 'single'
  unitOhm: number | 'auto'
  switchOhm: number
  minWidthUm: number
  minLengthUm: number
  twoRConstruction: TwoRConstruction
  latchDelayS: number
}

/** What the sizing chose for one candidate. Lengths in µm, areas in µm², σ dimensionless. */
export interface UnitSizing {
  unitOhm: number
  unitOhmChoice: 'given' | 'area' | 'power' | 'settling'
  sigmaUnit: number
  sigmaRequired: number
  sigmaForInl: number
  sigmaForDnl: number
  limitedBy: 'inl' | 'dnl' | 'min-size'
  unitWidthUm: number
  unitLengthUm: number
  unitAreaUm2: number
  matchingAreaUm2: number
  minSizeAreaUm2: number
}

/** A_R for ONE element about the array mean (%·µm → fraction·µm): a pair coefficient is divided by √2. */
export function singleCoefficientUm(process: Pick<SizingProcess, 'matchingPctUm' | 'matchingConvention'>, trace?: Trace): number {
  const f = process.matchingConvention === 'pair' ? F.singlePair : F.singleSingle
  return f.use({ A_R: process.matchingPctUm }, trace, 'aSingleUm')
}

/** Unit area (µm²) for a required σ_u: W·L = (A_R,single / σ_u)². */
export function matchingAreaUm2(aSingleUm: number, sigmaUnit: number, trace?: Trace): number {
  return F.matchingArea.use({ A_s: aSingleUm, sigma_u: sigmaUnit }, trace, 'matchingAreaUm2', { A_s: 'aSingleUm', sigma_u: 'sigmaUnitRequired' })
}

/** Smallest drawable area (µm²) of a resistor of `squares` = R/R_□ with W ≥ W_min, L ≥ L_min. */
export function minSizeAreaUm2(squares: number, minWidthUm: number, minLengthUm: number, trace?: Trace): number {
  const w = F.minWidth.use({ W_min: minWidthUm, L_min: minLengthUm, n_sq: squares }, trace, 'minWidthUm', { n_sq: 'squares' })
  return F.minArea.use({ n_sq: squares, W_0: w }, trace, 'minSizeAreaUm2', { n_sq: 'squares', W_0: 'minWidthUm' })
}

/** Approximate R_in,min/R and R_out,max/R per shape, used only to choose R_unit ('auto'). */
function loadFactors(s: CandidateShape): { rinPerR: number, routPerR: number } {
  const n = s.bits
  const l = lowBits(s)
  switch (s.topology) {
    case 'string': return { rinPerR: 2 ** n, routPerR: 2 ** n / 4 }
    case 'r2r-voltage': return { rinPerR: 9 / (n + 1), routPerR: 1 }
    case 'r2r-current': return { rinPerR: 1, routPerR: 1 }
    case 'segmented': {
      const m = s.unaryBits ?? 1
      return { rinPerR: m === 1 ? 9 / (n + 1) : 8 / 2 ** m, routPerR: 2 / 2 ** m }
    }
    case 'two-stage-string': {
      const m = s.coarseBits ?? 1
      return { rinPerR: s.buffered ? 2 ** m : 2 ** (m - l), routPerR: 2 ** l / 4 + 1 }
    }
  }
}

/**
 * Unit resistance (ohms): the given value, or for 'auto' the value with the smallest drawn unit
 * (R = R_□·L_min/W_min) clamped to [power floor V_REF²/(P·r_in), settling ceiling]; the power
 * budget wins when the two conflict [CP].
 */
export function chooseUnitOhm(s: CandidateShape, spec: SizingSpec, process: SizingProcess, trace?: Trace): { unitOhm: number, choice: UnitSizing['unitOhmChoice'] } {
  if (process.unitOhm !== 'auto') {
    if (trace) {
      trace.unitOhm = { kind: 'procedure', procedure: 'given', inputs: { unitOhm: process.unitOhm }, result: process.unitOhm }
    }
    return { unitOhm: process.unitOhm, choice: 'given' }
  }
  const { rinPerR, routPerR } = loadFactors(s)
  const t: Trace = {}
  const rPower = F.rPower.use({ V_REF: spec.vrefV, P_max: spec.powerBudgetW, r_in: rinPerR }, t, 'unitOhmPower')
  const tauMax = F.tauMax.use({ f_upd: spec.updateRateHz, t_latch: process.latchDelayS, N: spec.bits }, t, 'tauMaxS')
  const rSettle = spec.loadCapacitanceF > 0
    ? F.rSettle.use({ tau_max: tauMax, C_L: spec.loadCapacitanceF, R_sw: process.switchOhm, r_out: routPerR }, t, 'unitOhmSettling', { tau_max: 'tauMaxS' })
    : Infinity
  const rArea = F.rArea.use({ R_sq: process.sheetOhmPerSq, L_min: process.minLengthUm, W_min: process.minWidthUm }, t, 'unitOhmArea')
  const chosen = pickUnitOhm(rPower, rSettle, rArea)
  if (trace) {
    Object.assign(trace, t)
    const key = { power: 'unitOhmPower', settling: 'unitOhmSettling', area: 'unitOhmArea' }[chosen.choice]
    trace.unitOhm = { ...t[key]!, ...(chosen.choice === 'settling' ? { from: { tau_max: 'tauMaxS' } } : {}) }
    trace.unitOhmChoice = { kind: 'procedure', procedure: 'choice', inputs: { unitOhmPower: rPower, unitOhmSettling: Number.isFinite(rSettle) ? rSettle : null, unitOhmArea: rArea }, result: chosen.choice }
  }
  return chosen
}

/** The area-optimal unit clamped to [power floor, settling ceiling]; the power budget wins a conflict [CP]. */
function pickUnitOhm(rPower: number, rSettle: number, rArea: number): { unitOhm: number, choice: 'power' | 'settling' | 'area' } {
  if (rArea < rPower) {
    return { unitOhm: rPower, choice: 'power' }
  }
  if (rArea > rSettle) {
    return rSettle >= rPower ? { unitOhm: rSettle, choice: 'settling' } : { unitOhm: rPower, choice: 'power' }
  }
  return { unitOhm: rArea, choice: 'area' }
}

/** σ_u found on the sizing sample (evaluation/sampled-sizing.ts) instead of the closed forms. */
export interface SampledSigmas {
  trials: number
  sigmaForInl: number
  sigmaForDnl: number
  /** every criterion together (INL, DNL and, when required, monotonicity) */
  sigmaForAll: number
}

function sampledSigmas(given: SampledSigmas, spec: SizingSpec, trace?: Trace): { sInl: number, sDnl: number, sigmaRequired: number } {
  if (trace) {
    const entry = (key: string, criterion: string, result: number) => {
      trace[key] = { kind: 'procedure', procedure: 'sampled-sizing', inputs: { trials: given.trials, yieldTarget: spec.yieldTarget, criterion }, result }
    }
    entry('sigmaForInl', 'INL', given.sigmaForInl)
    entry('sigmaForDnl', 'DNL', given.sigmaForDnl)
    entry('sigmaUnitRequired', 'all', given.sigmaForAll)
  }
  return { sInl: given.sigmaForInl, sDnl: given.sigmaForDnl, sigmaRequired: given.sigmaForAll }
}

function closedFormSigmas(s: CandidateShape, spec: SizingSpec, process: SizingProcess, trace?: Trace): { sInl: number, sDnl: number, sigmaRequired: number } {
  const twoR = process.twoRConstruction
  const sInl = sigmaForInl(s, twoR, spec.inlTargetLsb, spec.yieldTarget, trace)
  const sDnl = sigmaForDnl(s, twoR, spec.dnlTargetLsb, spec.yieldTarget, trace)
  const sigmaRequired = F.sigmaRequired.use({ s_inl: sInl, s_dnl: sDnl }, trace, 'sigmaUnitRequired', { s_inl: 'sigmaForInl', s_dnl: 'sigmaForDnl' })
  return { sInl, sDnl, sigmaRequired }
}

/**
 * Sizes the unit resistor of a candidate: σ_u required by INL and DNL at the yield target (from
 * the sizing sample when `given`, else the closed forms), the matching area, the value-driven
 * minimum, and the drawn W × L (the larger area wins).
 */
export function sizeUnit(s: CandidateShape, spec: SizingSpec, process: SizingProcess, trace?: Trace, given?: SampledSigmas): UnitSizing {
  const { sInl, sDnl, sigmaRequired } = given ? sampledSigmas(given, spec, trace) : closedFormSigmas(s, spec, process, trace)
  const aSingle = singleCoefficientUm(process, trace)
  const { unitOhm, choice } = chooseUnitOhm(s, spec, process, trace)
  const squares = F.squares.use({ R_unit: unitOhm, R_sq: process.sheetOhmPerSq }, trace, 'squares', { R_unit: 'unitOhm' })
  const match = matchingAreaUm2(aSingle, sigmaRequired, trace)
  const minimum = minSizeAreaUm2(squares, process.minWidthUm, process.minLengthUm, trace)
  const area = F.unitArea.use({ A_match: match, A_min: minimum }, trace, 'unitAreaUm2', { A_match: 'matchingAreaUm2', A_min: 'minSizeAreaUm2' })
  const limitedBy = minimum > match ? 'min-size' : sInl <= sDnl ? 'inl' : 'dnl'
  if (trace) {
    trace.sizingLimitedBy = { kind: 'procedure', procedure: 'choice', inputs: { matchingAreaUm2: match, minSizeAreaUm2: minimum, sigmaForInl: sInl, sigmaForDnl: sDnl }, result: limitedBy }
  }
  const fromArea = { A_unit: 'unitAreaUm2', n_sq: 'squares' }
  return {
    unitOhm,
    unitOhmChoice: choice,
    sigmaUnit: F.sigmaAchieved.use({ A_s: aSingle, A_unit: area }, trace, 'sigmaUnit', { A_s: 'aSingleUm', A_unit: 'unitAreaUm2' }),
    sigmaRequired,
    sigmaForInl: sInl,
    sigmaForDnl: sDnl,
    limitedBy,
    unitWidthUm: F.width.use({ A_unit: area, n_sq: squares }, trace, 'unitWidthUm', fromArea),
    unitLengthUm: F.length.use({ A_unit: area, n_sq: squares }, trace, 'unitLengthUm', fromArea),
    unitAreaUm2: area,
    matchingAreaUm2: match,
    minSizeAreaUm2: minimum
  }
}
