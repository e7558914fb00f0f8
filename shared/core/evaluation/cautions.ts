/**
 * Engineering cautions carried in every evaluate output (MODELS.md §10, in our own words), plus
 * notes that depend on the request.
 */
import type { EvaluateInput } from '../contract/evaluate'

const ALWAYS = [
  'First-order models for ranking architectures only: sign-off needs transistor-level simulation with the foundry resistor and switch models, mismatch Monte Carlo, corners, temperature and extracted parasitics.',
  'Mismatch coefficients, their pair/single convention, edge and contact terms and gradients must come from the process design kit; the area law is not valid for very narrow or short resistors.',
  'Random mismatch only: gradients, voltage and temperature coefficients, self-heating, contact resistance, leakage and switch on-resistance variation are not in the Monte Carlo (equal switch on-resistance is, as a systematic term).',
  'Glitch figures are relative rankings: real glitch depends on driver timing, layout, supply and reference bounce, digital feedthrough and the output buffer; break-before-make effects need simulation.',
  'Reference-load and settling limits assume an ideal or first-order reference; the reference buffer, its decoupling and the package and board path must be verified.',
  'Current-mode ladders need an I-V amplifier that is stable over the code-dependent output resistance; their settling is set by that amplifier (tauS uses R_fb = R with the load as a stand-in).',
  'ESD, overvoltage and safe-operating limits at the reference pins are out of scope.',
  'Candidates in one Monte Carlo trial share their random numbers (common random numbers): each yield is unbiased, and yields of different candidates are correlated.'
]

/** Cautions for one request. */
export function cautionsFor(input: EvaluateInput): string[] {
  const out = [...ALWAYS]
  const def = input.options.inlDefinition
  out.push(`INL and its yields use the ${def === 'endpoint' ? 'endpoint (terminal-based)' : 'least-squares best-fit'} line; gain and offset are assumed trimmed to that line, and yields under another definition differ.`)
  if (def === 'best-fit') {
    out.push('Sizing and the analytic yields use the endpoint-INL models, which are conservative for best-fit INL; the Monte Carlo yields use the best-fit line.')
  }
  if (input.options.trials === 0) {
    out.push('No Monte Carlo trials were run: yields are the analytic approximations.')
  }
  if (input.options.topologies.includes('two-stage-string') && input.process.bufferOffsetSigmaV === 0) {
    out.push('Two-stage buffered strings assume offset-free buffers (process.bufferOffsetSigmaV = 0); real buffer offsets add directly to DNL at segment boundaries.')
  }
  if (input.process.unitOhm === 'auto') {
    out.push('Unit resistance chosen automatically (unitOhm = "auto") from approximate power and settling limits; check metrics.unitOhm.')
  }
  return out
}
