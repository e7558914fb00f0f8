/**
 * What the solver and ngspice benchmarks share: the row type, the median, and the mismatched
 * ladders both sides solve.
 */
import { buildCircuit } from '../../shared/core/circuits/index'
import type { R2rVoltageInput } from '../../shared/core/contract/solve'
import { createNormalSource } from '../../shared/core/stats/rng'

export interface BenchRow {
  name: string
  value: number
  unit: string
  target: string
  pass: boolean
}

export const SIGMA_UNIT = 0.01
export const UNIT_OHM = 10e3
export const VREF_V = 2.5

export function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)] as number
}

/** `count` R-2R ladders of `bits` bits with unit mismatch SIGMA_UNIT, reproducible from `seed`. */
export function ladders(bits: number, count: number, seed: number): R2rVoltageInput[] {
  const normal = createNormalSource(seed)
  return Array.from({ length: count }, () => buildCircuit({ topology: 'r2r-voltage', bits }, { unitOhm: UNIT_OHM, vrefV: VREF_V, sigmaUnit: SIGMA_UNIT, normal }) as R2rVoltageInput)
}
