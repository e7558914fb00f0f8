/**
 * Solver benchmarks (section of `npm run bench`):
 * 1. exact solve of a mismatched 16-bit R-2R ladder, all 65,536 codes with I_REF and R_out;
 * 2. ngspice against the engine on the same 200 mismatched 8-bit ladders (ngspice.ts).
 */
import type { R2rVoltageInput } from '../../shared/core/contract/solve'
import { solveCircuit } from '../../shared/core/solve/index'
import { solveR2rVoltage } from '../../shared/core/solve/r2r'
import type { BenchRow } from './ladders'
import { ladders, median } from './ladders'
import { benchVsNgspice } from './ngspice'

export type { BenchRow } from './ladders'

/** Median wall time (ms) of the full 16-bit exact solve (typed arrays), and of the JSON contract form. */
function bench16(): BenchRow[] {
  const [c] = ladders(16, 1, 16) as [R2rVoltageInput]
  for (let i = 0; i < 5; i++) solveR2rVoltage(c)
  const times: number[] = []
  for (let i = 0; i < 30; i++) {
    const t0 = performance.now()
    solveR2rVoltage(c)
    times.push(performance.now() - t0)
  }
  const contract: number[] = []
  for (let i = 0; i < 5; i++) {
    const t0 = performance.now()
    solveCircuit(c)
    contract.push(performance.now() - t0)
  }
  const ms = median(times)
  return [
    { name: 'exact solve, 16-bit mismatched R-2R, 65,536 codes with V, I_REF, R_out', value: ms, unit: 'ms', target: '< 10 ms', pass: ms < 10 },
    { name: 'same, as the solve contract (65,536 JSON-ready entries)', value: median(contract), unit: 'ms', target: 'informational', pass: true }
  ]
}

/** Runs the solver benchmarks and returns one row per measurement. */
export function runSolveBench(): BenchRow[] {
  return [...bench16(), ...benchVsNgspice()]
}
