/**
 * Switch on-resistance in ladders and segmented DACs, designed as an architect would before a
 * candidate is compared (handbook §4.4 and §11). Each leg of an R-2R ladder, and each unary and
 * ladder leg of a segmented DAC, ends in a changeover switch of on-resistance r = R_on / w (w: the
 * switch's width as a multiple of the process's switch). The handlings:
 * - `none`: legs 2R in series with r; the binary weights break by ≈ 2^N·r/(6R) LSB at midscale.
 * - `absorbed`: leg resistors drawn as 2R − r, so leg plus switch is 2R again [derived, exact].
 * - `dummy`: legs 2R + r, series arms (and the segmented joint) R + r/2, termination 2R plus an
 *   always-on dummy switch: an R'-2R' ladder with R' = R + r/2 [derived, exact].
 * - `scaled`: switch widths scaled with the weight of their leg (MSB widest, at least w = 1 down
 *   the ladder), no change to the resistors [common practice, no source].
 * What remains in silicon is r's departure from the value designed for: its spread relative to
 * the resistors over process and temperature (`switchSpreadPct`, applied at both corners) and its
 * mismatch (`switchMismatchPct`, σ of one process switch, falling as 1/√w).
 * All values here are relative to the unit resistor R (R = 1).
 */
import type { CandidateShape } from './shapes'
import { lowBits } from './shapes'

export const SWITCH_HANDLINGS = ['none', 'absorbed', 'dummy', 'scaled'] as const
export type SwitchHandling = typeof SWITCH_HANDLINGS[number]

/** Switch widths the design search tries (multiples of the process's switch). */
export const SWITCH_SCALES = [1, 2, 4, 8, 16, 32, 64] as const

/** Share of the INL and DNL targets the switches may take [common practice, no source: about a tenth]. */
export const SWITCH_ERROR_SHARE = 0.1

/** A switch design of one candidate. */
export interface SwitchDesign {
  handling: SwitchHandling
  /** width multiple of the widest switch (unary legs, or the ladder MSB leg) */
  scale: number
}

/** Deterministic element values (relative to R) of a ladder or segmented design at one corner. */
export interface LadderDesignValues {
  /** resistor of each binary leg, MSB first */
  legs: Float64Array
  /** switch on-resistance of each binary leg at the corner */
  legSwitch: Float64Array
  /** series arms, MSB side first */
  series: Float64Array
  termination: number
  /** dummy switch in the termination at the corner (0 when none) */
  terminationSwitch: number
  /** segmented: unary leg resistor and its switch at the corner */
  unary: number
  unarySwitch: number
  /** segmented: joint resistor */
  joint: number
  /** width multiple of each binary leg's switch and of a unary leg's switch */
  legWidths: Float64Array
  unaryWidth: number
}

/** True for the shapes whose legs carry changeover switches in series (ladders, segmented). */
export function hasLegSwitches(s: CandidateShape): boolean {
  return s.topology === 'r2r-voltage' || s.topology === 'r2r-current' || s.topology === 'segmented'
}

/** Binary legs of a shape (N for a ladder, L for segmented) and their weight relative to the widest leg. */
function binaryLegs(s: CandidateShape): { count: number, firstWeight: number } {
  return s.topology === 'segmented' ? { count: lowBits(s), firstWeight: 0.5 } : { count: s.bits, firstWeight: 1 }
}

/**
 * Element values of a design. `rho` = R_on / R of the process's switch (width 1); `delta` the
 * relative departure of every switch from its design value (a corner: +spread or −spread).
 */
export function designValues(s: CandidateShape, d: SwitchDesign, rho: number, delta: number): LadderDesignValues {
  const { count, firstWeight } = binaryLegs(s)
  const r = rho / d.scale
  const legWidths = new Float64Array(count)
  const legs = new Float64Array(count)
  const legSwitch = new Float64Array(count)
  for (let i = 0; i < count; i++) {
    const w = d.handling === 'scaled' ? Math.max(1, d.scale * firstWeight / 2 ** i) : d.scale
    legWidths[i] = w
    const rDesign = rho / w
    legs[i] = d.handling === 'absorbed' ? 2 - rDesign : 2
    legSwitch[i] = rDesign * (1 + delta)
  }
  const arm = d.handling === 'dummy' ? 1 + r / 2 : 1
  return {
    legs,
    legSwitch,
    series: new Float64Array(Math.max(0, count - 1)).fill(arm),
    termination: 2,
    terminationSwitch: d.handling === 'dummy' ? r * (1 + delta) : 0,
    unary: d.handling === 'absorbed' ? 2 - r : 2,
    unarySwitch: r * (1 + delta),
    joint: arm,
    legWidths,
    unaryWidth: d.scale
  }
}

/** Switch area in units of the process's switch area: Σ widths (+ the dummy switch). */
export function switchWidthUnits(s: CandidateShape, v: LadderDesignValues, handling: SwitchHandling): number {
  let sum = 0
  for (let i = 0; i < v.legWidths.length; i++) sum += v.legWidths[i]!
  if (s.topology === 'segmented') sum += v.unaryWidth * (2 ** (s.unaryBits ?? 1) - 1)
  return sum + (handling === 'dummy' ? v.unaryWidth : 0)
}

/** Whether a handling can be built: absorbing r needs a leg resistor left (2R − r ≥ R). */
export function designFeasible(d: SwitchDesign, rho: number): boolean {
  return d.handling !== 'absorbed' || rho / d.scale <= 1
}

/** Every design the search considers, cheapest first within a width. */
export function designSpace(rho: number): SwitchDesign[] {
  const out: SwitchDesign[] = []
  for (const scale of SWITCH_SCALES) {
    for (const handling of SWITCH_HANDLINGS) {
      if (handling === 'scaled' && scale === 1) continue
      const d = { handling, scale }
      if (designFeasible(d, rho)) out.push(d)
    }
  }
  return out
}

/** Switch corners to check: the design value alone, or both ends of the spread. */
export function switchCorners(spreadPct: number): number[] {
  return spreadPct > 0 ? [spreadPct / 100, -spreadPct / 100] : [0]
}
