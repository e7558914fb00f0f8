/**
 * Unit-resistor draws shared by the builders (see types.ts for the convention).
 */
import type { BuildOptions } from './types'

/** Draws unit resistors: nominal when σ is 0, else R (1 + σ z) per unit. */
export interface UnitDrawer {
  /** one element of `units` units in series, each of value `unitOhm` nominally */
  element: (units: number, unitOhm?: number) => number
  /** `count` elements of `units` units each */
  elements: (count: number, units: number, unitOhm?: number) => number[]
  /** one 2R element under the chosen construction */
  twoR: () => number
  /** `count` 2R elements */
  twoRs: (count: number) => number[]
  /** one offset voltage (V): nominal + σ_os z */
  offset: (nominalV: number) => number
}

/**
 * Creates a drawer for the given options.
 * @throws Error when sigmaUnit (or sigmaOffsetV) > 0 and no normal source is given
 */
export function unitDrawer(o: BuildOptions): UnitDrawer {
  const sigma = o.sigmaUnit ?? 0
  const sigmaOs = o.sigmaOffsetV ?? 0
  if ((sigma > 0 || sigmaOs > 0) && !o.normal) throw new Error('a Monte Carlo sample needs a normal source')
  const z = o.normal ?? (() => 0)
  const element = (units: number, unitOhm = o.unitOhm): number => {
    let r = 0
    if (sigma > 0) {
      for (let u = 0; u < units; u++) r += unitOhm * (1 + sigma * z())
    } else {
      for (let u = 0; u < units; u++) r += unitOhm
    }
    return r
  }
  const twoR = (): number => (o.twoR === 'single-element' ? element(1, 2 * o.unitOhm) : element(2))
  // Plain loops, not Array.from with a callback: a 16-bit string draws 2^16 elements per sample.
  const repeat = (count: number, draw: () => number): number[] => {
    const out = new Array<number>(count)
    for (let i = 0; i < count; i++) out[i] = draw()
    return out
  }
  return {
    element,
    elements: (count, units, unitOhm) => repeat(count, () => element(units, unitOhm)),
    twoR,
    twoRs: count => repeat(count, twoR),
    offset: nominalV => (sigmaOs > 0 ? nominalV + sigmaOs * z() : nominalV)
  }
}
