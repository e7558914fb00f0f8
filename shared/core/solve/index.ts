/**
 * Entry point of the exact solver: `solveCircuit(input)` → the fixed solve contract.
 * Inputs are assumed valid (parse them with `solveInputSchema` first).
 */
import type { SolveCode, SolveInput, SolveOutput } from '../contract/solve'
import { r2rCurrentLevels, r2rVoltageLevels, solveR2rCurrent, solveR2rVoltage } from './r2r'
import { segmentedLevels, solveSegmented } from './segmented'
import { solveString, solveTwoStage, stringLevels } from './string'
import type { CircuitSolution } from './types'

export type { CircuitSolution } from './types'

/**
 * A ladder or segmented input with per-leg switches folded into its legs (a switch in series with
 * its leg in either position, and the termination's dummy switch, are plain series resistance):
 * the same circuit with `switchOhm` 0, which the solvers below handle.
 */
export function foldSwitches(input: SolveInput): SolveInput {
  if (input.topology !== 'r2r-voltage' && input.topology !== 'r2r-current' && input.topology !== 'segmented') return input
  const sw = input.switchOhm ?? 0
  const legSw = input.legSwitchOhm
  const termSw = input.terminationSwitchOhm ?? 0
  if (!legSw && termSw === 0 && (input.topology !== 'segmented' || !input.unaryLegSwitchOhm)) return input
  const legsOhm = input.legsOhm.map((r, i) => r + (legSw ? legSw[i]! : sw))
  const base = { ...input, legsOhm, terminationOhm: input.terminationOhm + termSw, switchOhm: 0, legSwitchOhm: undefined, terminationSwitchOhm: undefined }
  if (input.topology !== 'segmented') return base
  const unarySw = input.unaryLegSwitchOhm
  return { ...base, topology: 'segmented', unaryLegsOhm: input.unaryLegsOhm.map((r, j) => r + (unarySw ? unarySw[j]! : sw)), unaryLegSwitchOhm: undefined } as SolveInput
}

/** Exact nodal solution of every code as typed arrays (the fast path for internal callers). */
export function solveCircuitArrays(raw: SolveInput): CircuitSolution {
  const input = foldSwitches(raw)
  switch (input.topology) {
    case 'string': return solveString(input)
    case 'r2r-voltage': return solveR2rVoltage(input)
    case 'r2r-current': return solveR2rCurrent(input)
    case 'segmented': return solveSegmented(input)
    case 'two-stage-string': return solveTwoStage(input)
  }
}

/**
 * The output level of every code (V, or A in current mode) exactly as `solveCircuitArrays`
 * gives it, without I_REF and R_out (for callers that need only the transfer curve).
 */
export function solveCircuitLevels(raw: SolveInput): Float64Array {
  const input = foldSwitches(raw)
  switch (input.topology) {
    case 'string': return stringLevels(input)
    case 'r2r-voltage': return r2rVoltageLevels(input)
    case 'r2r-current': return r2rCurrentLevels(input)
    case 'segmented': return segmentedLevels(input)
    case 'two-stage-string': return solveTwoStage(input).value
  }
}

function finiteOrNull(x: number): number | null {
  return Number.isFinite(x) ? x : null
}

function extremes(a: Float64Array): { min: number, max: number } {
  let min = Infinity
  let max = -Infinity
  for (let i = 0; i < a.length; i++) {
    const x = a[i] as number
    if (x < min) min = x
    if (x > max) max = x
  }
  return { min, max }
}

/**
 * Solves one circuit exactly for every code 0 … 2^N − 1 and returns the contract output:
 * per code `voutV` (voltage mode) or `ioutA` (current mode), `irefA` (A drawn from V_REF) and
 * `routOhm` (Thevenin resistance at the output, `null` where infinite), plus a summary.
 */
export function solveCircuit(input: SolveInput): SolveOutput {
  const sol = solveCircuitArrays(input)
  const key = sol.output === 'voltage' ? 'voutV' : 'ioutA'
  const codes: SolveCode[] = new Array(sol.value.length)
  for (let k = 0; k < sol.value.length; k++) {
    codes[k] = { code: k, [key]: sol.value[k] as number, irefA: sol.irefA[k] as number, routOhm: finiteOrNull(sol.routOhm[k] as number) }
  }
  const iref = extremes(sol.irefA)
  const rout = extremes(sol.routOhm)
  return {
    topology: input.topology,
    bits: input.bits,
    vrefV: input.vrefV,
    output: sol.output,
    codes,
    summary: {
      irefMinA: iref.min,
      irefMaxA: iref.max,
      rinMinOhm: finiteOrNull(input.vrefV / iref.max),
      routMinOhm: finiteOrNull(rout.min),
      routMaxOhm: finiteOrNull(rout.max)
    }
  }
}
