/**
 * Exact all-code solve of the canonical segmented DAC (MODELS.md §2.4): 2^M − 1 unary legs on
 * the output node, joined through `jointOhm` to an L-bit voltage-mode ladder.
 * Code k = m · 2^L + c: m unary legs on (legs 0 … m−1), ladder code c.
 */
import type { SegmentedInput } from '../contract/solve'
import { linearAllCodes, quadraticAllCodes } from './codes'
import { segmentedRoutOhm, segmentedWeights } from './ladder'
import { chainInverse } from './tridiagonal'
import type { CircuitSolution } from './types'

/** Nodal chain over [output, ladder 0 … L−1]: shunt conductances (S) and series resistances (ohms). */
function segmentedChain(s: SegmentedInput, gu: Float64Array, g: Float64Array): { shunt: Float64Array, series: number[] } {
  const l = g.length
  const shunt = new Float64Array(l + 1)
  shunt[0] = gu.reduce((acc, x) => acc + x, 0)
  for (let i = 0; i < l; i++) shunt[i + 1] = g[i] as number
  shunt[l] = (shunt[l] as number) + 1 / s.terminationOhm
  return { shunt, series: [s.jointOhm, ...s.seriesOhm] }
}

/**
 * I_REF / V_REF = Σ_on g − uᵀ H u with u = (U(m), b∘g), U(m) = Σ_{j<m} g_u,j. Splitting u gives
 * U + Sb(c) − U² H00 − 2 U Lb(c), with Sb(c) = bᵀ(D − D H_bb D)b and Lb(c) = Σ H_0,1+i g_i b_i,
 * each enumerated once over the 2^L ladder codes: O(1) per code afterwards.
 */
function segmentedIref(s: SegmentedInput, gu: Float64Array, g: Float64Array, out: Float64Array): void {
  const l = g.length
  const n = l + 1
  const { shunt, series } = segmentedChain(s, gu, g)
  const h = chainInverse(shunt, series)
  const qb = new Float64Array(l * l)
  const lin = new Float64Array(l)
  for (let i = 0; i < l; i++) {
    lin[i] = (h[i + 1] as number) * (g[i] as number)
    for (let j = 0; j < l; j++) {
      qb[i * l + j] = (i === j ? g[i] as number : 0) - (g[i] as number) * (h[(i + 1) * n + j + 1] as number) * (g[j] as number)
    }
  }
  const fine = 2 ** l
  const sb = quadraticAllCodes(qb, l, 1, new Float64Array(fine))
  const lb = linearAllCodes(lin, 1, new Float64Array(fine))
  const h00 = h[0] as number
  let u = 0
  for (let m = 0; m <= gu.length; m++) {
    if (m > 0) u += gu[m - 1] as number
    const base = m * fine
    const constant = u - u * u * h00
    for (let c = 0; c < fine; c++) {
      out[base + c] = s.vrefV * (constant + (sb[c] as number) - 2 * u * (lb[c] as number))
    }
  }
}

/** Segmented DAC: V_out(m, c) = V_REF (Σ_{j<m} unary_j + Σ b_i binary_i); R_out code independent. */
export function solveSegmented(s: SegmentedInput): CircuitSolution {
  const sw = s.switchOhm ?? 0
  const fine = 2 ** s.legsOhm.length
  const codes = (s.unaryLegsOhm.length + 1) * fine
  const value = segmentedLevels(s)
  const gu = Float64Array.from(s.unaryLegsOhm, r => 1 / (r + sw))
  const g = Float64Array.from(s.legsOhm, r => 1 / (r + sw))
  const irefA = new Float64Array(codes)
  segmentedIref(s, gu, g, irefA)
  const rout = segmentedRoutOhm(s.unaryLegsOhm, s.jointOhm, s.legsOhm, s.seriesOhm, s.terminationOhm, sw)
  return { output: 'voltage', value, irefA, routOhm: new Float64Array(codes).fill(rout) }
}

/** The output voltages of `solveSegmented` alone (no I_REF, no R_out). */
export function segmentedLevels(s: SegmentedInput): Float64Array {
  const sw = s.switchOhm ?? 0
  const fine = 2 ** s.legsOhm.length
  const codes = (s.unaryLegsOhm.length + 1) * fine
  const { unary, binary } = segmentedWeights(s.unaryLegsOhm, s.jointOhm, s.legsOhm, s.seriesOhm, s.terminationOhm, sw)
  const lsb = linearAllCodes(binary, s.vrefV, new Float64Array(fine))
  const value = new Float64Array(codes)
  let msb = 0
  for (let m = 0; m <= unary.length; m++) {
    if (m > 0) msb += s.vrefV * (unary[m - 1] as number)
    for (let c = 0; c < fine; c++) value[m * fine + c] = msb + (lsb[c] as number)
  }
  return value
}
