/**
 * Analytic mismatch statistics per candidate (MODELS.md §4.2–4.5): how the unit resistor's
 * relative σ (σ_u) maps onto INL and DNL in LSB, and the σ_u a yield target allows.
 * All coefficients are first-order and labelled [D] in MODELS.md; they are checked against Monte
 * Carlo in tests/unit/shared/core/montecarlo-properties.spec.ts. Every number is computed through
 * the formula registry (explain/formulas/matching.ts); an optional `trace` records each use.
 */
import { MATCHING_FORMULAS as F } from '../explain/registry'
import type { Trace } from '../explain/types'
import type { CandidateShape, TwoRConstruction } from './shapes'
import { lowBits } from './shapes'

/** σ_DNL,mid / (2^(N−1) σ_u) of an R-2R ladder: √0.8 (2R = two units) or √(4/3) (single element). */
export function r2rDnlCoefficient(twoR: TwoRConstruction, trace?: Trace): number {
  return (twoR === 'two-units' ? F.kappaTwoUnits : F.kappaSingle).use({}, trace, 'kappa')
}

/** How INL scales with σ_u: `bridge` → sup|INL| ≈ scale·σ_u·|Brownian bridge|; `gauss` → σ_INL,max = scale·σ_u. */
export interface InlModel {
  kind: 'bridge' | 'gauss'
  scale: number
  /** number of random-walk steps of a bridge (elements of the unary array) */
  steps: number
}

/**
 * Continuity correction of a discretely sampled Brownian bridge: its maximum sits about
 * β·σ_step below the continuous one, β = −ζ(½)/√(2π) ≈ 0.5826 (Broadie, Glasserman, Kou 1997;
 * from memory). Monte Carlo of 6–10-bit strings agrees with K(·) corrected this way to ≈0.005.
 */
export const BRIDGE_DISCRETE_BETA = F.inlYieldBridge.spec.constants!.beta!.value

const KEY_INL = 'inlScale'

/** INL scaling per candidate (unit legs; σ_leg = σ_u/√2 for two-unit 2R legs). */
export function inlModel(s: CandidateShape, twoR: TwoRConstruction, trace?: Trace): InlModel {
  const N = s.bits
  const L = lowBits(s)
  const u = twoR === 'two-units' ? 2 : 1
  const from = { kappa: 'kappa' }
  switch (s.topology) {
    case 'string':
      return { kind: 'bridge', scale: F.inlScaleString.use({ N }, trace, KEY_INL), steps: 2 ** N }
    case 'r2r-voltage':
    case 'r2r-current':
      return { kind: 'gauss', scale: F.inlScaleR2r.use({ kappa: r2rDnlCoefficient(twoR, trace), N }, trace, KEY_INL, from), steps: 1 }
    case 'segmented': {
      const M = s.unaryBits ?? 1
      return M >= 3
        ? { kind: 'bridge', scale: F.inlScaleSegBridge.use({ L, M, u }, trace, KEY_INL), steps: 2 ** M }
        : { kind: 'gauss', scale: F.inlScaleSegGauss.use({ L, M, u }, trace, KEY_INL), steps: 1 }
    }
    case 'two-stage-string': {
      const M = s.coarseBits ?? 1
      return M >= 3
        ? { kind: 'bridge', scale: F.inlScaleTwoStageBridge.use({ N, M, L }, trace, KEY_INL), steps: 2 ** M }
        : { kind: 'gauss', scale: F.inlScaleTwoStageGauss.use({ N, M, L }, trace, KEY_INL), steps: 1 }
    }
  }
}

/** Worst one-code step: σ_DNL = scale·σ_u, repeated over `steps` nearly independent transitions. */
export interface DnlModel {
  scale: number
  steps: number
}

/** DNL scaling per candidate (MODELS.md §4.2, §4.4, §4.5, §2.5). */
export function dnlModel(s: CandidateShape, twoR: TwoRConstruction, trace?: Trace): DnlModel {
  const N = s.bits
  const key = 'dnlScale'
  const from = { kappa: 'kappa' }
  switch (s.topology) {
    case 'string':
      return { scale: F.dnlScaleString.use({}, trace, key), steps: 2 ** N - 1 }
    case 'r2r-voltage':
    case 'r2r-current':
      return { scale: F.dnlScaleR2r.use({ kappa: r2rDnlCoefficient(twoR, trace), N }, trace, key, from), steps: 1 }
    case 'segmented':
      return { scale: F.dnlScaleSeg.use({ kappa: r2rDnlCoefficient(twoR, trace), L: lowBits(s) }, trace, key, from), steps: 2 ** (s.unaryBits ?? 1) - 1 }
    case 'two-stage-string':
      // a fine step carries its own error and its coarse resistor's error
      return { scale: F.dnlScaleTwoStage.use({}, trace, key), steps: 2 ** N - 1 }
  }
}

const FROM_INL = { a: KEY_INL }
const FROM_DNL = { a: 'dnlScale' }

/** Analytic σ of the worst INL and DNL (LSB) for a given σ_u. */
export function analyticSigmas(s: CandidateShape, twoR: TwoRConstruction, sigmaUnit: number, trace?: Trace): { inlSigmaLsb: number, dnlSigmaLsb: number } {
  const inl = inlModel(s, twoR, trace)
  // a bridge's largest σ is at its midpoint: half the supremum scale
  const inlF = inl.kind === 'bridge' ? F.inlSigmaBridge : F.inlSigmaGauss
  const inlSigmaLsb = inlF.use({ a: inl.scale, sigma_u: sigmaUnit }, trace, 'inlSigmaLsb', FROM_INL)
  const dnl = dnlModel(s, twoR, trace)
  return { inlSigmaLsb, dnlSigmaLsb: F.dnlSigma.use({ a: dnl.scale, sigma_u: sigmaUnit }, trace, 'dnlSigmaLsb', FROM_DNL) }
}

/** Largest σ_u meeting the INL target at the yield target (Kolmogorov for bridges, two-sided Gauss else). */
export function sigmaForInl(s: CandidateShape, twoR: TwoRConstruction, inlTargetLsb: number, yieldTarget: number, trace?: Trace): number {
  const m = inlModel(s, twoR, trace)
  const f = m.kind === 'bridge' ? F.sigmaForInlBridge : F.sigmaForInlGauss
  return f.use({ T_INL: inlTargetLsb, Y: yieldTarget, a: m.scale }, trace, 'sigmaForInl', FROM_INL)
}

/** Largest σ_u meeting the DNL target at the yield target, each of `steps` steps at Y^(1/steps). */
export function sigmaForDnl(s: CandidateShape, twoR: TwoRConstruction, dnlTargetLsb: number, yieldTarget: number, trace?: Trace): number {
  const m = dnlModel(s, twoR, trace)
  return F.sigmaForDnl.use({ T_DNL: dnlTargetLsb, Y: yieldTarget, n: m.steps, a: m.scale }, trace, 'sigmaForDnl', FROM_DNL)
}

/**
 * Analytic INL yield for σ_u: K((T + β·σ_step)/(scale·σ_u)) for bridges (continuity-corrected,
 * σ_step = scale·σ_u/√steps), 2Φ(T/σ) − 1 for Gauss. Sizing keeps the uncorrected, slightly
 * conservative bound of the handbook (sigmaForInl).
 */
export function analyticInlYield(s: CandidateShape, twoR: TwoRConstruction, sigmaUnit: number, inlTargetLsb: number, trace?: Trace): number {
  const m = inlModel(s, twoR, trace)
  const key = 'inlYieldAnalytic'
  if (m.kind === 'bridge') {
    return F.inlYieldBridge.use({ T_INL: inlTargetLsb, a: m.scale, sigma_u: sigmaUnit, n: m.steps }, trace, key, FROM_INL)
  }
  return F.inlYieldGauss.use({ T_INL: inlTargetLsb, a: m.scale, sigma_u: sigmaUnit }, trace, key, FROM_INL)
}

/** Analytic DNL yield for σ_u: (2Φ(T/σ_DNL) − 1)^steps (steps independent, MODELS.md §4.3). */
export function analyticDnlYield(s: CandidateShape, twoR: TwoRConstruction, sigmaUnit: number, dnlTargetLsb: number, trace?: Trace): number {
  const m = dnlModel(s, twoR, trace)
  return F.dnlYield.use({ T_DNL: dnlTargetLsb, a: m.scale, sigma_u: sigmaUnit, n: m.steps }, trace, 'dnlYieldAnalytic', FROM_DNL)
}

/** Probability that every step stays above −1 LSB: Φ(1/σ_DNL)^steps (MODELS.md §4.3). */
export function analyticMonotonicYield(s: CandidateShape, twoR: TwoRConstruction, sigmaUnit: number, trace?: Trace): number {
  const m = dnlModel(s, twoR, trace)
  return F.monotonicYield.use({ a: m.scale, sigma_u: sigmaUnit, n: m.steps }, trace, 'monotonicYieldAnalytic', FROM_DNL)
}

/**
 * Van den Bosch et al. INL bound for unary arrays, σ_u ≤ 1/(2C√(2^N)) with C = Φ⁻¹((1+Y)/2):
 * a conservative (safe) bound for strings, reported for comparison with the bridge sizing.
 */
export function vanDenBoschSigmaUnit(bits: number, yieldTarget: number): number {
  return F.vanDenBosch.compute({ Y: yieldTarget, N: bits })
}
