/**
 * Builders of string circuits: single string (direct or tree decode) and two-stage string.
 */
import type { StringInput, TwoStageInput } from '../contract/solve'
import type { BuildOptions, StringDecode } from './types'
import { unitDrawer } from './units'

/**
 * 2^N unit resistors. The selecting switch path is lumped into `switchOhm`: one R_on for
 * direct (1-of-2^N) decode, N·R_on for a binary tree (MODELS.md §2.1).
 */
export function buildString(bits: number, decode: StringDecode, o: BuildOptions): StringInput {
  const d = unitDrawer(o)
  const ron = o.switchOhm ?? 0
  return {
    topology: 'string', bits, vrefV: o.vrefV, decode,
    switchOhm: decode === 'tree' ? bits * ron : ron,
    unitsOhm: d.elements(2 ** bits, 1)
  }
}

/**
 * Two-stage string: 2^M coarse units (coarseUnitOhm) and 2^L fine units (fineUnitOhm), one
 * switch R_on at the output tap (and, unbuffered, one in each coarse selection path). Buffer
 * offsets are drawn after all resistors (low, then high).
 */
export function buildTwoStage(bits: number, coarseBits: number, buffered: boolean, o: BuildOptions): TwoStageInput {
  const d = unitDrawer(o)
  const coarseOhm = d.elements(2 ** coarseBits, 1, o.coarseUnitOhm ?? o.unitOhm)
  const fineOhm = d.elements(2 ** (bits - coarseBits), 1, o.fineUnitOhm ?? o.unitOhm)
  const base: TwoStageInput = {
    topology: 'two-stage-string', bits, coarseBits, vrefV: o.vrefV, switchOhm: o.switchOhm ?? 0,
    coarseOhm, fineOhm, buffered
  }
  if (!buffered) return base
  const [lo, hi] = o.bufferOffsetV ?? [0, 0]
  return { ...base, bufferOffsetV: [d.offset(lo), d.offset(hi)] }
}
