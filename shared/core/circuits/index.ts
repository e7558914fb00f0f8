/**
 * `buildCircuit(shape, options)`: the explicit, solvable netlist of element values of a
 * candidate, nominal or one Monte Carlo sample; and its element counts.
 */
import type { SolveInput } from '../contract/solve'
import { buildR2r, buildSegmented } from './ladder'
import { buildString, buildTwoStage } from './string'
import type { BuildOptions, CircuitShape } from './types'

export type { BuildOptions, CircuitShape, StringDecode } from './types'

/**
 * Builds the circuit of a candidate shape (see types.ts for units and the draw order).
 * Nominal when `sigmaUnit` is 0 or absent; otherwise one sample drawn from `normal`.
 */
export function buildCircuit(shape: CircuitShape, options: BuildOptions): SolveInput {
  switch (shape.topology) {
    case 'string': return buildString(shape.bits, shape.decode ?? 'direct', options)
    case 'r2r-voltage':
    case 'r2r-current': return buildR2r(shape.topology, shape.bits, options)
    case 'segmented': return buildSegmented(shape.bits, shape.unaryBits, options)
    case 'two-stage-string': return buildTwoStage(shape.bits, shape.coarseBits, shape.buffered, options)
  }
}

/** Resistor elements and unit resistors of a built circuit (MODELS.md §3 counting). */
export interface ElementCounts {
  resistors: number
  units: number
}

/** Counts resistor elements and units per the builders' convention (2R = 2 units). */
export function elementCounts(shape: CircuitShape): ElementCounts {
  const n = shape.bits
  switch (shape.topology) {
    case 'string': return { resistors: 2 ** n, units: 2 ** n }
    case 'r2r-voltage':
    case 'r2r-current': return { resistors: 2 * n, units: 3 * n + 1 }
    case 'segmented': {
      const l = n - shape.unaryBits
      return { resistors: 2 ** shape.unaryBits + 2 * l, units: 2 ** (shape.unaryBits + 1) + 3 * l }
    }
    case 'two-stage-string': {
      const count = 2 ** shape.coarseBits + 2 ** (n - shape.coarseBits)
      return { resistors: count, units: count }
    }
  }
}
