/**
 * Unit resistor sizing (MODELS.md §4.1, §4.3–4.6): the σ_u the yield target allows, the unit
 * area from the Pelgrom area law (σ_u = A_R,single / √(W·L)), the value-driven minimum
 * (W ≥ W_min, L ≥ L_min at R_unit = R_□·L/W), and the unit resistance when asked to choose it.
 */
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
export function singleCoefficientUm(process: Pick<SizingProcess, 'matchingPctUm' | 'matchingConvention'>): number {
  const a = process.matchingPctUm / 100
  return process.matchingConvention === 'pair' ? a / Math.SQRT2 : a
}

/** Unit area (µm²) for a required σ_u: W·L = (A_R,single / σ_u)². */
export function matchingAreaUm2(aSingleUm: number, sigmaUnit: number): number {
  return (aSingleUm / sigmaUnit) ** 2
}

/** Smallest drawable area (µm²) of a resistor of `squares` = R/R_□ with W ≥ W_min, L ≥ L_min. */
export function minSizeAreaUm2(squares: number, minWidthUm: number, minLengthUm: number): number {
  const w = Math.max(minWidthUm, minLengthUm / squares)
  return squares * w * w
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
export function chooseUnitOhm(s: CandidateShape, spec: SizingSpec, process: SizingProcess): { unitOhm: number, choice: UnitSizing['unitOhmChoice'] } {
  if (process.unitOhm !== 'auto') {
    return { unitOhm: process.unitOhm, choice: 'given' }
  }
  const { rinPerR, routPerR } = loadFactors(s)
  const rPower = (spec.vrefV * spec.vrefV) / (spec.powerBudgetW * rinPerR)
  const tauMax = Math.max(0, 1 / spec.updateRateHz - process.latchDelayS) / ((spec.bits + 1) * Math.LN2)
  const rSettle = spec.loadCapacitanceF > 0 ? (tauMax / spec.loadCapacitanceF - process.switchOhm) / routPerR : Infinity
  const rArea = (process.sheetOhmPerSq * process.minLengthUm) / process.minWidthUm
  if (rArea < rPower) {
    return { unitOhm: rPower, choice: 'power' }
  }
  if (rArea > rSettle) {
    return rSettle >= rPower ? { unitOhm: rSettle, choice: 'settling' } : { unitOhm: rPower, choice: 'power' }
  }
  return { unitOhm: rArea, choice: 'area' }
}

/**
 * Sizes the unit resistor of a candidate: σ_u required by INL and DNL at the yield target, the
 * matching area, the value-driven minimum, and the drawn W × L (the larger area wins).
 */
export function sizeUnit(s: CandidateShape, spec: SizingSpec, process: SizingProcess): UnitSizing {
  const twoR = process.twoRConstruction
  const sInl = sigmaForInl(s, twoR, spec.inlTargetLsb, spec.yieldTarget)
  const sDnl = sigmaForDnl(s, twoR, spec.dnlTargetLsb, spec.yieldTarget)
  const sigmaRequired = Math.min(sInl, sDnl)
  const aSingle = singleCoefficientUm(process)
  const { unitOhm, choice } = chooseUnitOhm(s, spec, process)
  const squares = unitOhm / process.sheetOhmPerSq
  const match = matchingAreaUm2(aSingle, sigmaRequired)
  const minimum = minSizeAreaUm2(squares, process.minWidthUm, process.minLengthUm)
  const area = Math.max(match, minimum)
  return {
    unitOhm,
    unitOhmChoice: choice,
    sigmaUnit: aSingle / Math.sqrt(area),
    sigmaRequired,
    sigmaForInl: sInl,
    sigmaForDnl: sDnl,
    limitedBy: minimum > match ? 'min-size' : sInl <= sDnl ? 'inl' : 'dnl',
    unitWidthUm: Math.sqrt(area / squares),
    unitLengthUm: Math.sqrt(area * squares),
    unitAreaUm2: area,
    matchingAreaUm2: match,
    minSizeAreaUm2: minimum
  }
}

/**
 * The unit resistance (ohms) and per-unit relative σ (dimensionless, about the array mean) that
 * the sizing chose for a candidate: the values Monte Carlo sample circuits are drawn with.
 * A 2R element of two units has σ_u/√2; a single-element 2R has σ_u.
 */
export function unitOhmAndSigma(s: CandidateShape, spec: SizingSpec, process: SizingProcess): { unitOhm: number, sigmaUnit: number } {
  const sized = sizeUnit(s, spec, process)
  return { unitOhm: sized.unitOhm, sigmaUnit: sized.sigmaUnit }
}
