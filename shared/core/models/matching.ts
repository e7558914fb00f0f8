/**
 * Analytic mismatch statistics per candidate (MODELS.md §4.2–4.5): how the unit resistor's
 * relative σ (σ_u) maps onto INL and DNL in LSB, and the σ_u a yield target allows.
 * All coefficients are first-order and labelled [D] in MODELS.md; they are checked against Monte
 * Carlo in tests/unit/shared/core/montecarlo-properties.spec.ts.
 */
import { kolmogorovCdf, kolmogorovQuantile } from '../stats/kolmogorov'
import { normalCdf, normalQuantile, twoSidedFactor } from '../stats/normal'
import type { CandidateShape, TwoRConstruction } from './shapes'
import { lowBits } from './shapes'

/** σ_DNL,mid / (2^(N−1) σ_u) of an R-2R ladder: √0.8 (2R = two units) or √(4/3) (single element). */
export function r2rDnlCoefficient(twoR: TwoRConstruction): number {
  return twoR === 'two-units' ? Math.sqrt(0.8) : Math.sqrt(4 / 3)
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
export const BRIDGE_DISCRETE_BETA = 0.5826

/** INL scaling per candidate (unit legs; σ_leg = σ_u/√2 for two-unit 2R legs). */
export function inlModel(s: CandidateShape, twoR: TwoRConstruction): InlModel {
  const n = s.bits
  const l = lowBits(s)
  const legFactor = twoR === 'two-units' ? Math.SQRT1_2 : 1
  switch (s.topology) {
    case 'string':
      return { kind: 'bridge', scale: Math.sqrt(2 ** n), steps: 2 ** n }
    case 'r2r-voltage':
    case 'r2r-current':
      return { kind: 'gauss', scale: 0.5 * r2rDnlCoefficient(twoR) * 2 ** (n - 1), steps: 1 }
    case 'segmented': {
      const m = s.unaryBits ?? 1
      const bridge = 2 ** l * Math.sqrt(2 ** m) * legFactor
      return m >= 3 ? { kind: 'bridge', scale: bridge, steps: 2 ** m } : { kind: 'gauss', scale: 0.5 * bridge, steps: 1 }
    }
    case 'two-stage-string': {
      const m = s.coarseBits ?? 1
      const bridge = Math.sqrt(2 ** (2 * n - m) + 2 ** l)
      return m >= 3 ? { kind: 'bridge', scale: bridge, steps: 2 ** m } : { kind: 'gauss', scale: 0.5 * bridge, steps: 1 }
    }
  }
}

/** Worst one-code step: σ_DNL = scale·σ_u, repeated over `steps` nearly independent transitions. */
export interface DnlModel {
  scale: number
  steps: number
}

/** DNL scaling per candidate (MODELS.md §4.2, §4.4, §4.5, §2.5). */
export function dnlModel(s: CandidateShape, twoR: TwoRConstruction): DnlModel {
  const n = s.bits
  const kappa = r2rDnlCoefficient(twoR)
  switch (s.topology) {
    case 'string':
      return { scale: 1, steps: 2 ** n - 1 }
    case 'r2r-voltage':
    case 'r2r-current':
      return { scale: kappa * 2 ** (n - 1), steps: 1 }
    case 'segmented':
      return { scale: kappa * 2 ** lowBits(s), steps: 2 ** (s.unaryBits ?? 1) - 1 }
    case 'two-stage-string':
      // a fine step carries its own error and its coarse resistor's error
      return { scale: Math.SQRT2, steps: 2 ** n - 1 }
  }
}

/** Analytic σ of the worst INL and DNL (LSB) for a given σ_u. */
export function analyticSigmas(s: CandidateShape, twoR: TwoRConstruction, sigmaUnit: number): { inlSigmaLsb: number, dnlSigmaLsb: number } {
  const inl = inlModel(s, twoR)
  // a bridge's largest σ is at its midpoint: half the supremum scale
  const inlSigmaLsb = (inl.kind === 'bridge' ? 0.5 : 1) * inl.scale * sigmaUnit
  return { inlSigmaLsb, dnlSigmaLsb: dnlModel(s, twoR).scale * sigmaUnit }
}

/** Largest σ_u meeting the INL target at the yield target (Kolmogorov for bridges, two-sided Gauss else). */
export function sigmaForInl(s: CandidateShape, twoR: TwoRConstruction, inlTargetLsb: number, yieldTarget: number): number {
  const m = inlModel(s, twoR)
  const x = m.kind === 'bridge' ? kolmogorovQuantile(yieldTarget) : twoSidedFactor(yieldTarget)
  return inlTargetLsb / (x * m.scale)
}

/** Largest σ_u meeting the DNL target at the yield target, each of `steps` steps at Y^(1/steps). */
export function sigmaForDnl(s: CandidateShape, twoR: TwoRConstruction, dnlTargetLsb: number, yieldTarget: number): number {
  const m = dnlModel(s, twoR)
  const perStep = Math.exp(Math.log(yieldTarget) / m.steps)
  const c = normalQuantile((1 + perStep) / 2)
  return dnlTargetLsb / (c * m.scale)
}

/**
 * Analytic INL yield for σ_u: K((T + β·σ_step)/(scale·σ_u)) for bridges (continuity-corrected,
 * σ_step = scale·σ_u/√steps), 2Φ(T/σ) − 1 for Gauss. Sizing keeps the uncorrected, slightly
 * conservative bound of the handbook (sigmaForInl).
 */
export function analyticInlYield(s: CandidateShape, twoR: TwoRConstruction, sigmaUnit: number, inlTargetLsb: number): number {
  const m = inlModel(s, twoR)
  const sigmaSup = m.scale * sigmaUnit
  if (m.kind === 'bridge') {
    return kolmogorovCdf((inlTargetLsb + (BRIDGE_DISCRETE_BETA * sigmaSup) / Math.sqrt(m.steps)) / sigmaSup)
  }
  return 2 * normalCdf(inlTargetLsb / sigmaSup) - 1
}

/** Analytic DNL yield for σ_u: (2Φ(T/σ_DNL) − 1)^steps (steps independent, MODELS.md §4.3). */
export function analyticDnlYield(s: CandidateShape, twoR: TwoRConstruction, sigmaUnit: number, dnlTargetLsb: number): number {
  const m = dnlModel(s, twoR)
  const p = 2 * normalCdf(dnlTargetLsb / (m.scale * sigmaUnit)) - 1
  return Math.exp(m.steps * Math.log(Math.max(p, 1e-300)))
}

/** Probability that every step stays above −1 LSB: Φ(1/σ_DNL)^steps (MODELS.md §4.3). */
export function analyticMonotonicYield(s: CandidateShape, twoR: TwoRConstruction, sigmaUnit: number): number {
  const m = dnlModel(s, twoR)
  return Math.exp(m.steps * Math.log(Math.max(normalCdf(1 / (m.scale * sigmaUnit)), 1e-300)))
}

/**
 * Van den Bosch et al. INL bound for unary arrays, σ_u ≤ 1/(2C√(2^N)) with C = Φ⁻¹((1+Y)/2):
 * a conservative (safe) bound for strings, reported for comparison with the bridge sizing.
 */
export function vanDenBoschSigmaUnit(bits: number, yieldTarget: number): number {
  return 1 / (2 * twoSidedFactor(yieldTarget) * Math.sqrt(2 ** bits))
}
