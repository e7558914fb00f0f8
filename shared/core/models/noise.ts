/**
 * Thermal noise (MODELS.md §8): Johnson–Nyquist v² = 4kTRΔf; through a single-pole RC load the
 * density is shaped by 1/(1 + (f/f_p)²), so the noise integrated up to f_max is
 * 4kTR·f_p·atan(f_max/f_p), which tends to kT/C for f_max → ∞ and to 4kTR·f_max for C → 0.
 */

/** Boltzmann constant (J/K), exact since the 2019 SI redefinition. */
export const BOLTZMANN_J_PER_K = 1.380649e-23

/** √(4kTRΔf) (V rms) for R in ohms, Δf in Hz, T in kelvin. */
export function thermalNoiseVrms(rOhm: number, bandwidthHz: number, temperatureK = 300): number {
  return Math.sqrt(4 * BOLTZMANN_J_PER_K * temperatureK * rOhm * bandwidthHz)
}

/** √(kT/C) (V rms), the total noise on a capacitor C (farads). */
export function ktcNoiseVrms(capacitanceF: number, temperatureK = 300): number {
  return Math.sqrt((BOLTZMANN_J_PER_K * temperatureK) / capacitanceF)
}

/** Noise (V rms) of R through the pole of R·C, integrated from 0 to f_max (Hz). C = 0: no pole. */
export function rcNoiseVrms(rOhm: number, capacitanceF: number, fMaxHz: number, temperatureK = 300): number {
  if (!(capacitanceF > 0) || !(rOhm > 0)) {
    return thermalNoiseVrms(Math.max(0, rOhm), fMaxHz, temperatureK)
  }
  const fp = 1 / (2 * Math.PI * rOhm * capacitanceF)
  return Math.sqrt(4 * BOLTZMANN_J_PER_K * temperatureK * rOhm * fp * Math.atan(fMaxHz / fp))
}

/** Quantisation noise V_LSB/√12 (V rms) of an ideal N-bit converter over V_FS. */
export function quantisationNoiseVrms(vFsV: number, bits: number): number {
  return vFsV / 2 ** bits / Math.sqrt(12)
}
