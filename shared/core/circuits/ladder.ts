/**
 * Builders of ladder circuits: R-2R (voltage and current mode) and segmented (MODELS.md §2.2–2.4).
 * Legs and termination are 2R (two units), series and joint resistors R (one unit).
 */
import type { R2rCurrentInput, R2rVoltageInput, SegmentedInput } from '../contract/solve'
import type { BuildOptions } from './types'
import { unitDrawer } from './units'

/**
 * R-2R ladder of `bits` legs: 3N + 1 units (N legs of 2, N − 1 series of 1, termination of 2).
 * Draw order: legs MSB→LSB, series, termination.
 */
export function buildR2r(
  topology: 'r2r-voltage' | 'r2r-current',
  bits: number,
  o: BuildOptions
): R2rVoltageInput | R2rCurrentInput {
  const d = unitDrawer(o)
  const legsOhm = d.twoRs(bits)
  const seriesOhm = d.elements(bits - 1, 1)
  const terminationOhm = d.twoR()
  const base = { topology, bits, vrefV: o.vrefV, switchOhm: o.switchOhm ?? 0, legsOhm, seriesOhm, terminationOhm }
  return o.design ? { ...base, ...designed(base, o) } : base
}

/** The design's trims and switches on drawn ladder elements (values relative to R in `o.design`). */
function designed(c: { legsOhm: number[], seriesOhm: number[], terminationOhm: number }, o: BuildOptions) {
  const v = o.design!
  const r = o.unitOhm
  return {
    switchOhm: 0,
    legsOhm: c.legsOhm.map((x, i) => x + (v.legs[i]! - 2) * r),
    seriesOhm: c.seriesOhm.map((x, i) => x + (v.series[i]! - 1) * r),
    terminationOhm: c.terminationOhm + (v.termination - 2) * r,
    legSwitchOhm: Array.from(v.legSwitch, x => x * r),
    terminationSwitchOhm: v.terminationSwitch * r
  }
}

/**
 * Canonical segmented DAC: 2^M − 1 unary 2R legs, a joint R, an L-bit R-2R section
 * (2^{M+1} + 3L units). Draw order: unary legs, joint, ladder legs, series, termination.
 */
export function buildSegmented(bits: number, unaryBits: number, o: BuildOptions): SegmentedInput {
  const d = unitDrawer(o)
  const l = bits - unaryBits
  const unaryLegsOhm = d.twoRs(2 ** unaryBits - 1)
  const jointOhm = d.element(1)
  const legsOhm = d.twoRs(l)
  const seriesOhm = d.elements(l - 1, 1)
  const terminationOhm = d.twoR()
  const base: SegmentedInput = {
    topology: 'segmented', bits, unaryBits, vrefV: o.vrefV, switchOhm: o.switchOhm ?? 0,
    unaryLegsOhm, jointOhm, legsOhm, seriesOhm, terminationOhm
  }
  if (!o.design) return base
  const v = o.design
  const r = o.unitOhm
  return {
    ...base,
    ...designed(base, o),
    unaryLegsOhm: unaryLegsOhm.map(x => x + (v.unary - 2) * r),
    jointOhm: jointOhm + (v.joint - 1) * r,
    unaryLegSwitchOhm: unaryLegsOhm.map(() => v.unarySwitch * r)
  }
}
