/**
 * Exact all-code solves of R-2R ladders, voltage mode and current mode (MODELS.md §2.2, §2.3
 * conventions): node 0 = MSB/output end, leg i = legsOhm[i] + switchOhm in either switch
 * position, series i between node i and i+1, termination from node N−1 to ground.
 */
import type { R2rCurrentInput, R2rVoltageInput } from '../contract/solve'
import { linearAllCodes, quadraticAllCodes } from './codes'
import { ladderRoutOhm, ladderWeights } from './ladder'
import { chainInverse } from './tridiagonal'
import type { CircuitSolution } from './types'

interface LadderValues {
  legsOhm: ArrayLike<number>
  seriesOhm: ArrayLike<number>
  terminationOhm: number
  switchOhm?: number
}

/** Leg conductances g_i = 1/(R_leg,i + R_sw) (siemens). */
function legConductances(c: LadderValues): Float64Array {
  const sw = c.switchOhm ?? 0
  return Float64Array.from({ length: c.legsOhm.length }, (_, i) => 1 / ((c.legsOhm[i] as number) + sw))
}

/**
 * Nodal chain of the ladder with every leg ended on a source: shunt conductances (legs, plus the
 * termination at node N−1) and series resistances. With `groundNode0`, node 0 is held at a fixed
 * potential and removed (current mode, V_REF drives it): the chain then covers nodes 1 … N−1 and
 * series resistor 0 becomes part of node 1's shunt.
 */
function ladderChain(c: LadderValues, g: Float64Array, groundNode0: boolean): { shunt: Float64Array, series: ArrayLike<number> } {
  const n = g.length
  const shunt = Float64Array.from(g)
  shunt[n - 1] = (shunt[n - 1] as number) + 1 / c.terminationOhm
  if (!groundNode0) return { shunt, series: c.seriesOhm }
  shunt[1] = (shunt[1] as number) + 1 / (c.seriesOhm[0] as number)
  return { shunt: shunt.subarray(1), series: Array.from(c.seriesOhm).slice(1) }
}

/**
 * Q = D − D H D over the legs (siemens), H = inverse of the nodal matrix whose node indices
 * start at `offset` within the legs (legs below the offset sit on a fixed node: H = 0 there).
 * bᵀ Q b is then the power-free "current per volt" quadratic form of the on-legs.
 */
function legQuadratic(g: Float64Array, h: Float64Array, offset: number): Float64Array {
  const n = g.length
  const m = n - offset
  const q = new Float64Array(n * n)
  for (let i = 0; i < n; i++) q[i * n + i] = g[i] as number
  for (let i = offset; i < n; i++) {
    for (let j = offset; j < n; j++) {
      const hij = h[(i - offset) * m + (j - offset)] as number
      q[i * n + j] = (q[i * n + j] as number) - (g[i] as number) * hij * (g[j] as number)
    }
  }
  return q
}

/**
 * Voltage-mode ladder: V_out(k) = V_REF Σ b_i w_i; I_REF(k) = V_REF · bᵀ(D − D G⁻¹ D)b (the
 * current of the on-legs, a quadratic form); R_out is code independent (G⁻¹)_00.
 */
export function solveR2rVoltage(c: R2rVoltageInput | (LadderValues & { vrefV: number })): CircuitSolution {
  const n = c.legsOhm.length
  const codes = 2 ** n
  const sw = c.switchOhm ?? 0
  const value = r2rVoltageLevels(c)
  const g = legConductances(c)
  const { shunt, series } = ladderChain(c, g, false)
  const q = legQuadratic(g, chainInverse(shunt, series), 0)
  const irefA = quadraticAllCodes(q, n, c.vrefV, new Float64Array(codes))
  const routOhm = new Float64Array(codes).fill(ladderRoutOhm(c.legsOhm, c.seriesOhm, c.terminationOhm, sw))
  return { output: 'voltage', value, irefA, routOhm }
}

/**
 * Current-mode ladder: V_REF drives node 0, every leg ends at 0 V (output pin or ground), so
 * node voltages are code independent: I_OUT(k) = Σ b_i I_leg,i, I_REF = V_REF / R_in constant.
 * R_out(k) at the output pin with V_REF shorted: 1 / bᵀ(D − D H' D)b, H' the inverse with node 0
 * grounded; Infinity at code 0.
 */
export function solveR2rCurrent(c: R2rCurrentInput | (LadderValues & { vrefV: number })): CircuitSolution {
  const n = c.legsOhm.length
  const codes = 2 ** n
  const sw = c.switchOhm ?? 0
  // node voltages per volt at node 0 are x_i / x_0 of the voltage-mode chain: I_leg,i = V_REF w_i / R_00
  const rIn = ladderRoutOhm(c.legsOhm, c.seriesOhm, c.terminationOhm, sw)
  const value = currentLevels(c, rIn)
  const irefA = new Float64Array(codes).fill(c.vrefV / rIn)
  const g = legConductances(c)
  const { shunt, series } = ladderChain(c, g, true)
  const q = legQuadratic(g, chainInverse(shunt, series), 1)
  const routOhm = quadraticAllCodes(q, n, 1, new Float64Array(codes))
  for (let k = 0; k < codes; k++) routOhm[k] = 1 / (routOhm[k] as number)
  return { output: 'current', value, irefA, routOhm }
}

/** The output voltages of `solveR2rVoltage` alone (no I_REF, no R_out). */
export function r2rVoltageLevels(c: LadderValues & { vrefV: number }): Float64Array {
  const w = ladderWeights(c.legsOhm, c.seriesOhm, c.terminationOhm, c.switchOhm ?? 0)
  return linearAllCodes(w, c.vrefV, new Float64Array(2 ** c.legsOhm.length))
}

/** The output currents of `solveR2rCurrent` alone (no R_out). */
export function r2rCurrentLevels(c: LadderValues & { vrefV: number }): Float64Array {
  return currentLevels(c, ladderRoutOhm(c.legsOhm, c.seriesOhm, c.terminationOhm, c.switchOhm ?? 0))
}

/** I_OUT(k) = Σ b_i w_i V_REF / R_in, given R_in. */
function currentLevels(c: LadderValues & { vrefV: number }, rIn: number): Float64Array {
  const w = ladderWeights(c.legsOhm, c.seriesOhm, c.terminationOhm, c.switchOhm ?? 0)
  return linearAllCodes(w, c.vrefV / rIn, new Float64Array(2 ** c.legsOhm.length))
}
