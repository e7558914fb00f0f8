/**
 * Exact all-code solves of resistor strings: single string (Kelvin divider) and two-stage
 * string–string, buffered or unbuffered. Index 0 of every resistor array is at the low end.
 */
import type { StringInput, TwoStageInput } from '../contract/solve'
import type { CircuitSolution } from './types'

/** Prefix sums: out[k] = Σ_{i<k} r_i, length r.length + 1. */
export function prefixSums(r: ArrayLike<number>): Float64Array {
  const out = new Float64Array(r.length + 1)
  for (let i = 0; i < r.length; i++) out[i + 1] = (out[i] as number) + (r[i] as number)
  return out
}

/** Suffix sums: out[k] = Σ_{i≥k} r_i (no cancellation near the top of a long string). */
export function suffixSums(r: ArrayLike<number>): Float64Array {
  const out = new Float64Array(r.length + 1)
  for (let i = r.length - 1; i >= 0; i--) out[i] = (out[i + 1] as number) + (r[i] as number)
  return out
}

/**
 * Resistor string: code k selects the tap with k resistors below it.
 * V(k) = V_REF S_k / S, R_out(k) = S_k (S − S_k) / S + R_sw, I_REF = V_REF / S for every code.
 */
export function solveString(c: StringInput): CircuitSolution {
  const codes = c.unitsOhm.length
  const below = prefixSums(c.unitsOhm)
  const above = suffixSums(c.unitsOhm)
  const total = below[codes] as number
  const sw = c.switchOhm ?? 0
  const value = tapLevels(c.vrefV, below, codes)
  const routOhm = new Float64Array(codes)
  for (let k = 0; k < codes; k++) {
    routOhm[k] = (below[k] as number) * (above[k] as number) / total + sw
  }
  return { output: 'voltage', value, irefA: new Float64Array(codes).fill(c.vrefV / total), routOhm }
}

/** Tap voltages V_REF S_k / S from the prefix sums (`below[codes]` = S). */
function tapLevels(vrefV: number, below: Float64Array, codes: number): Float64Array {
  const total = below[codes] as number
  const value = new Float64Array(codes)
  for (let k = 0; k < codes; k++) {
    value[k] = vrefV * (below[k] as number) / total
  }
  return value
}

/** The output levels of `solveString` alone (no R_out, no I_REF). */
export function stringLevels(c: StringInput): Float64Array {
  return tapLevels(c.vrefV, prefixSums(c.unitsOhm), c.unitsOhm.length)
}

/**
 * Thevenin resistance at a fine tap of the unbuffered two-stage string (V_REF shorted): tap T
 * joins coarse node A through `a` and node B through `b`; A–B is the selected coarse resistor,
 * A and B see `rBelow` and `rAbove` to AC ground. The A–B–ground triangle is turned into a star
 * (Δ→Y), which stays exact when rBelow or rAbove is 0 (that node is ground).
 */
export function bridgeRoutOhm(a: number, b: number, rc: number, rBelow: number, rAbove: number): number {
  const sum = rc + rBelow + rAbove
  const ra = rc * rBelow / sum
  const rb = rc * rAbove / sum
  const rg = rBelow * rAbove / sum
  const left = a + ra
  const right = b + rb
  return left * right / (left + right) + rg
}

/** Code k = c · 2^L + f: coarse segment c, fine tap f (f resistors of the fine string below). */
function segmentSolve(s: TwoStageInput, c: number, out: CircuitSolution, base: number, sums: Sums): void {
  const sw = s.switchOhm ?? 0
  const rc = s.coarseOhm[c] as number
  const rBelow = sums.coarseBelow[c] as number
  const rAbove = sums.coarseAbove[c + 1] as number
  const fineTotal = sums.fineBelow[s.fineOhm.length] as number
  if (s.buffered) {
    const [osLo, osHi] = s.bufferOffsetV ?? [0, 0]
    const total = sums.coarseBelow[s.coarseOhm.length] as number
    const vLo = s.vrefV * rBelow / total + osLo
    const vHi = s.vrefV * (rBelow + rc) / total + osHi
    for (let f = 0; f < s.fineOhm.length; f++) {
      const fb = sums.fineBelow[f] as number
      const fa = sums.fineAbove[f] as number
      out.value[base + f] = vLo + (vHi - vLo) * fb / fineTotal
      out.routOhm[base + f] = fb * fa / fineTotal + sw
      out.irefA[base + f] = s.vrefV / total
    }
    return
  }
  // unbuffered: the fine string plus its two coarse selection switches shunts resistor c
  const rFine = fineTotal + 2 * sw
  const rSeg = rc * rFine / (rc + rFine)
  const iRef = s.vrefV / (rBelow + rSeg + rAbove)
  const vA = iRef * rBelow
  const vB = vA + iRef * rSeg
  for (let f = 0; f < s.fineOhm.length; f++) {
    const a = sw + (sums.fineBelow[f] as number)
    const b = sw + (sums.fineAbove[f] as number)
    out.value[base + f] = vA + (vB - vA) * a / rFine
    out.routOhm[base + f] = bridgeRoutOhm(a, b, rc, rBelow, rAbove) + sw
    out.irefA[base + f] = iRef
  }
}

interface Sums {
  coarseBelow: Float64Array
  coarseAbove: Float64Array
  fineBelow: Float64Array
  fineAbove: Float64Array
}

/**
 * Two-stage string. Buffered: ideal buffers (plus optional offsets) copy the selected segment's
 * ends onto the fine string; the coarse string is unloaded. Unbuffered: the fine string hangs
 * across the selected coarse resistor through two coarse switches (R_sw each), solved exactly.
 * The fine tap switch (R_sw) is in series with the output in both cases.
 */
export function solveTwoStage(s: TwoStageInput): CircuitSolution {
  const codes = s.coarseOhm.length * s.fineOhm.length
  const out: CircuitSolution = {
    output: 'voltage',
    value: new Float64Array(codes),
    irefA: new Float64Array(codes),
    routOhm: new Float64Array(codes)
  }
  const sums: Sums = {
    coarseBelow: prefixSums(s.coarseOhm),
    coarseAbove: suffixSums(s.coarseOhm),
    fineBelow: prefixSums(s.fineOhm),
    fineAbove: suffixSums(s.fineOhm)
  }
  for (let c = 0; c < s.coarseOhm.length; c++) segmentSolve(s, c, out, c * s.fineOhm.length, sums)
  return out
}
