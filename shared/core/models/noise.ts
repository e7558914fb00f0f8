/**
 * Thermal noise (MODELS.md §8): Johnson–Nyquist v² = 4kTRΔf; through a single-pole RC load the
 * density is shaped by 1/(1 + (f/f_p)²), so the noise integrated up to f_max is
 * 4kTR·f_p·atan(f_max/f_p), which tends to kT/C for f_max → ∞ and to 4kTR·f_max for C → 0.
 * Computed through the formula registry (explain/formulas/output.ts).
 */
import { OUTPUT_FORMULAS as F } from '../explain/registry'
import type { Trace } from '../explain/types'

/** Boltzmann constant (J/K), exact since the 2019 SI redefinition. */
export const BOLTZMANN_J_PER_K = F.thermalNoise.spec.constants!.k_B!.value

/** √(4kTRΔf) (V rms) for R in ohms, Δf in Hz, T in kelvin. */
export function thermalNoiseVrms(rOhm: number, bandwidthHz: number, temperatureK = 300, trace?: Trace, key = 'noiseVrms'): number {
  return F.thermalNoise.use({ T: temperatureK, R: rOhm, df: bandwidthHz }, trace, key)
}

/** √(kT/C) (V rms), the total noise on a capacitor C (farads). */
export function ktcNoiseVrms(capacitanceF: number, temperatureK = 300, trace?: Trace): number {
  return F.ktcNoise.use({ T: temperatureK, C_L: capacitanceF }, trace, 'noiseKtcVrms')
}

/** Noise (V rms) of R through the pole of R·C, integrated from 0 to f_max (Hz). C = 0: no pole. */
export function rcNoiseVrms(rOhm: number, capacitanceF: number, fMaxHz: number, temperatureK = 300, trace?: Trace): number {
  if (!(capacitanceF > 0) || !(rOhm > 0)) {
    return thermalNoiseVrms(Math.max(0, rOhm), fMaxHz, temperatureK, trace)
  }
  const fp = F.pole.use({ R: rOhm, C_L: capacitanceF }, trace, 'noisePoleHz', { R: 'routEffMaxOhm' })
  return F.rcNoise.use({ T: temperatureK, R: rOhm, f_p: fp, f_max: fMaxHz }, trace, 'noiseVrms', { R: 'routEffMaxOhm', f_p: 'noisePoleHz' })
}

/** Quantisation noise V_LSB/√12 (V rms) of an ideal N-bit converter over V_FS. */
export function quantisationNoiseVrms(vFsV: number, bits: number, trace?: Trace): number {
  return F.quantNoise.use({ V_FS: vFsV, N: bits }, trace, 'quantNoiseVrms')
}
