/**
 * Mismatch formulas (MODELS.md §4.2–4.5, §2.5): the scales that map σ_u onto INL and DNL per
 * topology, σ_INL and σ_DNL, the σ_u a yield target allows, and the analytic yields.
 * Every coefficient is derived in the handbook [D] unless its reference says otherwise.
 */
import { defineFormula } from '../define'
import type { Formula } from '../define'
import type { HandbookReference, QuantitySpec } from '../types'
import { Q, q } from './quantities'

const ref = (section: string, note?: string): HandbookReference => ({ section, label: 'derived', ...(note ? { note } : {}) })
const SCALE = { name: 'scale', symbol: 'a', unit: '', description: 'the statistic in units of σ_u' }

function scale(id: string, title: string, expression: string, inputs: Record<string, QuantitySpec>, section: string): Formula {
  return defineFormula({ id: `matching.${id}`, title, description: title, expression, inputs, output: SCALE, reference: ref(section) })
}

const KAPPA = q('κ', '', 'σ_DNL,mid / (2^(N−1)·σ_u) of an R-2R ladder')
const BETA = { symbol: 'β', unit: '', description: 'discrete-bridge continuity correction −ζ(½)/√(2π) (Broadie, Glasserman, Kou 1997; from memory)', value: 0.5826 }
const yieldOut = (name: string, what: string) => ({ name, symbol: `Y_${what}`, unit: '', description: `probability that |${what}| stays within its target` })
const sigmaOut = (name: string, what: string) => ({ name, symbol: `σ_${what}`, unit: 'LSB', description: `σ of the worst ${what}` })
const allowOut = (name: string, what: string) => ({ name, symbol: `σ_u,${what}`, unit: '', description: `largest σ_u meeting the ${what} target at the yield target` })

export const MATCHING_FORMULAS = {
  kappaTwoUnits: defineFormula({
    id: 'matching.kappa.two-units', title: 'R-2R DNL coefficient, 2R = two units', expression: 'sqrt(0.8)', inputs: {},
    description: 'Linearising the midscale step of a ladder whose 2R legs are two units in series gives Var = 0.8·(2^(N−1)σ_u)².',
    output: { name: 'kappa', ...KAPPA }, reference: ref('§4.4')
  }),
  kappaSingle: defineFormula({
    id: 'matching.kappa.single-element', title: 'R-2R DNL coefficient, 2R = one element', expression: 'sqrt(4 / 3)', inputs: {},
    description: 'The same linearisation when each 2R is a single element as uncertain as one unit.',
    output: { name: 'kappa', ...KAPPA }, reference: ref('§4.4')
  }),
  inlScaleString: scale('inl-scale.string', 'String INL is a Brownian bridge over 2^N units', 'sqrt(2^N)', { N: Q.N }, '§4.2'),
  inlScaleR2r: scale('inl-scale.r2r', 'Ladder INL peaks at half the midscale DNL', '0.5 * kappa * 2^(N - 1)', { kappa: KAPPA, N: Q.N }, '§4.4'),
  inlScaleSegBridge: scale('inl-scale.segmented-bridge', 'Unary legs of weight 2^L form a bridge of 2^M steps', '2^L * sqrt(2^M) * sqrt(1 / u)', { L: Q.L, M: Q.M, u: Q.u }, '§4.5'),
  inlScaleSegGauss: scale('inl-scale.segmented-gauss', 'Few unary legs: the midpoint σ of the bridge', '0.5 * (2^L * sqrt(2^M) * sqrt(1 / u))', { L: Q.L, M: Q.M, u: Q.u }, '§4.5'),
  inlScaleTwoStageBridge: scale('inl-scale.two-stage-bridge', 'Coarse segments form a bridge; each fine string adds its own', 'sqrt(2^(2 * N - M) + 2^L)', { N: Q.N, M: Q.M, L: Q.L }, '§2.5'),
  inlScaleTwoStageGauss: scale('inl-scale.two-stage-gauss', 'Few coarse segments: the midpoint σ of the bridge', '0.5 * sqrt(2^(2 * N - M) + 2^L)', { N: Q.N, M: Q.M, L: Q.L }, '§2.5'),
  dnlScaleString: scale('dnl-scale.string', 'A string step is one unit: σ_DNL ≈ σ_u', '1', {}, '§4.2'),
  dnlScaleR2r: scale('dnl-scale.r2r', 'The midscale step of a ladder', 'kappa * 2^(N - 1)', { kappa: KAPPA, N: Q.N }, '§4.4'),
  dnlScaleSeg: scale('dnl-scale.segmented', 'The unary/binary boundary step', 'kappa * 2^L', { kappa: KAPPA, L: Q.L }, '§4.5'),
  dnlScaleTwoStage: scale('dnl-scale.two-stage', 'A fine step carries its own and its coarse resistor\'s error', 'sqrt(2)', {}, '§2.5'),
  inlSigmaBridge: defineFormula({
    id: 'matching.inl-sigma.bridge', title: 'σ of the INL at the bridge midpoint', expression: '0.5 * a * sigma_u',
    description: 'A bridge is widest at its midpoint, where its σ is half the supremum scale.', inputs: { a: Q.a, sigma_u: Q.sigmaU },
    output: sigmaOut('inlSigmaLsb', 'INL'), reference: ref('§4.2, §4.5')
  }),
  inlSigmaGauss: defineFormula({
    id: 'matching.inl-sigma.gauss', title: 'σ of the worst INL', expression: 'a * sigma_u',
    description: 'The worst INL is one Gaussian quantity of σ = a·σ_u.', inputs: { a: Q.a, sigma_u: Q.sigmaU },
    output: sigmaOut('inlSigmaLsb', 'INL'), reference: ref('§4.4')
  }),
  dnlSigma: defineFormula({
    id: 'matching.dnl-sigma', title: 'σ of the worst DNL step', expression: 'a * sigma_u',
    description: 'The worst one-code step has σ = a·σ_u.', inputs: { a: Q.a, sigma_u: Q.sigmaU },
    output: sigmaOut('dnlSigmaLsb', 'DNL'), reference: ref('§4.2, §4.4, §4.5')
  }),
  sigmaForInlBridge: defineFormula({
    id: 'matching.sigma-for-inl.bridge', title: 'σ_u allowed by the INL target (Kolmogorov bound)', expression: 'T_INL / (Kinv(Y) * a)',
    description: 'The supremum of a Brownian bridge follows the Kolmogorov distribution K; its Y-quantile must fit the target.',
    inputs: { T_INL: Q.inlT, Y: Q.Y, a: Q.a }, output: allowOut('sigmaForInl', 'INL'), reference: ref('§4.3 item 2', 'Kolmogorov distribution from memory')
  }),
  sigmaForInlGauss: defineFormula({
    id: 'matching.sigma-for-inl.gauss', title: 'σ_u allowed by the INL target (two-sided Gauss)', expression: 'T_INL / (C2(Y) * a)',
    description: 'The worst INL is Gaussian; C2(Y) = Φ⁻¹((1+Y)/2) σ must fit the target.',
    inputs: { T_INL: Q.inlT, Y: Q.Y, a: Q.a }, output: allowOut('sigmaForInl', 'INL'), reference: ref('§4.3')
  }),
  sigmaForDnl: defineFormula({
    id: 'matching.sigma-for-dnl', title: 'σ_u allowed by the DNL target', expression: 'T_DNL / (Phiinv((1 + exp(log(Y) / n)) / 2) * a)',
    description: 'Each of n nearly independent steps must pass with probability Y^(1/n).',
    inputs: { T_DNL: Q.dnlT, Y: Q.Y, n: Q.n, a: Q.a }, output: allowOut('sigmaForDnl', 'DNL'), reference: ref('§4.3')
  }),
  inlYieldBridge: defineFormula({
    id: 'matching.inl-yield.bridge', title: 'Analytic INL yield of a bridge', expression: 'K((T_INL + beta * (a * sigma_u) / sqrt(n)) / (a * sigma_u))',
    description: 'Kolmogorov CDF of the target over the supremum scale, corrected for a bridge sampled at n points.',
    inputs: { T_INL: Q.inlT, a: Q.a, sigma_u: Q.sigmaU, n: Q.n }, constants: { beta: BETA },
    output: yieldOut('inlYield', 'INL'), reference: ref('§4.3 item 2')
  }),
  inlYieldGauss: defineFormula({
    id: 'matching.inl-yield.gauss', title: 'Analytic INL yield, Gaussian worst INL', expression: '2 * Phi(T_INL / (a * sigma_u)) - 1',
    description: 'Probability that a Gaussian of σ = a·σ_u stays within ±T.', inputs: { T_INL: Q.inlT, a: Q.a, sigma_u: Q.sigmaU },
    output: yieldOut('inlYield', 'INL'), reference: ref('§4.3')
  }),
  dnlYield: defineFormula({
    id: 'matching.dnl-yield', title: 'Analytic DNL yield', expression: 'exp(n * log(max(2 * Phi(T_DNL / (a * sigma_u)) - 1, 1e-300)))',
    description: 'Every one of n independent steps within ±T: (2Φ(T/σ) − 1)^n, taken through logarithms.',
    inputs: { T_DNL: Q.dnlT, a: Q.a, sigma_u: Q.sigmaU, n: Q.n }, output: yieldOut('dnlYield', 'DNL'), reference: ref('§4.3', 'consistent with Park & Yang\'s independence result')
  }),
  monotonicYield: defineFormula({
    id: 'matching.monotonic-yield', title: 'Analytic monotonicity yield', expression: 'exp(n * log(max(Phi(1 / (a * sigma_u)), 1e-300)))',
    description: 'Every one of n steps stays above −1 LSB: Φ(1/σ)^n.', inputs: { a: Q.a, sigma_u: Q.sigmaU, n: Q.n },
    output: yieldOut('monotonicYield', 'monotonic'), reference: ref('§4.3')
  }),
  vanDenBosch: defineFormula({
    id: 'matching.van-den-bosch', title: 'Van den Bosch INL bound for unary arrays', expression: '1 / (2 * C2(Y) * sqrt(2^N))',
    description: 'The published current-steering bound; safe (conservative) for strings.', inputs: { Y: Q.Y, N: Q.N },
    output: allowOut('sigmaVanDenBosch', 'INL'), reference: { section: '§4.3 item 1', label: 'memory', note: 'paper published (Van den Bosch et al. 2001); formula from memory' }
  })
}
