/**
 * Shapes and options of the circuit builders. A builder turns a candidate shape plus a unit
 * resistor value into an explicit netlist of element values (a solve input), either nominal or
 * one Monte Carlo sample.
 *
 * Unit convention (MODELS.md §3): every element is made of unit resistors, each drawn
 * independently as R_u (1 + σ_u z) with z standard normal: R = one unit, 2R = two units in
 * series (default, `twoR: 'two-units'`), or with `twoR: 'single-element'` one element of value
 * 2R_u and relative σ_u (a unit-area device). Draw order (for reproducible samples): elements
 * in the order of the solve input's arrays, MSB first, the two units of a 2R element one after
 * the other.
 */
import type { LadderDesignValues } from '../models/switch-design'
import type { NormalSource } from '../stats/rng'

export type StringDecode = 'direct' | 'tree'

export type CircuitShape
  = | { topology: 'string', bits: number, decode?: StringDecode }
    | { topology: 'r2r-voltage' | 'r2r-current', bits: number }
    | { topology: 'segmented', bits: number, unaryBits: number }
    | { topology: 'two-stage-string', bits: number, coarseBits: number, buffered: boolean }

export interface BuildOptions {
  /** unit resistor value R (ohms); for two-stage strings the default of both strings */
  unitOhm: number
  /** reference voltage (V) */
  vrefV: number
  /** on-resistance of one switch (ohms); a tree-decoded string puts N of them in series */
  switchOhm?: number
  /** relative σ of one unit resistor about the array mean (dimensionless); 0 or absent = nominal */
  sigmaUnit?: number
  /** standard normal source, required when sigmaUnit > 0 (use a seeded one, never Math.random) */
  normal?: NormalSource
  /** how 2R elements are made, default 'two-units' */
  twoR?: 'two-units' | 'single-element'
  /** two-stage string: coarse unit (ohms), default unitOhm */
  coarseUnitOhm?: number
  /** two-stage string: fine unit (ohms), default unitOhm */
  fineUnitOhm?: number
  /** buffered two-stage string: nominal buffer offsets [low, high] (V) */
  bufferOffsetV?: [number, number]
  /** buffered two-stage string: σ of each buffer offset (V), drawn after all resistors */
  sigmaOffsetV?: number
  /**
   * ladders and segmented: the switch design's element values relative to R (switch-design.ts);
   * resistors are drawn as before and trimmed by the design (2R − r, R + r/2), and each leg gets
   * its own switch (`legSwitchOhm`, `unaryLegSwitchOhm`, `terminationSwitchOhm`) instead of `switchOhm`
   */
  design?: LadderDesignValues | null
}
