/**
 * Element counts (MODELS.md §3) as formulas, one per topology and count. String counts are
 * published (Kester, Data Conversion Handbook); the ladder, segmented and two-stage counts are
 * derived by counting the netlist builder's elements.
 */
import { defineFormula } from '../define'
import type { Formula } from '../define'
import type { HandbookReference, QuantitySpec } from '../types'
import { Q } from './quantities'

const S: HandbookReference = { section: '§3', label: 'published', note: 'W. Kester (ed.), Data Conversion Handbook' }
const D: HandbookReference = { section: '§3', label: 'derived', note: 'counted in the netlist builder' }
const CP: HandbookReference = { section: '§3', label: 'common-practice', note: 'one gate per decoded line, one inverter per tree bit' }

function count(id: string, title: string, expression: string, inputs: Record<string, QuantitySpec>, output: [string, string, string], reference: HandbookReference): Formula {
  return defineFormula({
    id: `counts.${id}`, title, description: title, expression, inputs,
    output: { name: output[0], symbol: output[1], unit: '', description: output[2] }, reference
  })
}

const RES: [string, string, string] = ['resistorCount', 'n_R', 'resistors (elements)']
const UNITS: [string, string, string] = ['unitResistorCount', 'n_u', 'unit resistors']
const SW: [string, string, string] = ['switchCount', 'n_sw', 'switches']
const DEC: [string, string, string] = ['decoderGateCount', 'n_g', 'decoder gates']
const PATH: [string, string, string] = ['switchesInPath', 'n_path', 'switches between a tap and the output']

export const COUNT_FORMULAS = {
  stringResistors: count('string.resistors', 'A string has one unit resistor per code', '2^N', { N: Q.N }, RES, S),
  stringUnits: count('string.units', 'Every string resistor is one unit', '2^N', { N: Q.N }, UNITS, S),
  stringDirectSwitches: count('string.direct-switches', 'One tap switch per code (direct decode)', '2^N', { N: Q.N }, SW, S),
  stringTreeSwitches: count('string.tree-switches', 'A binary switch tree has 2 + 4 + … + 2^N switches', '2^(N + 1) - 2', { N: Q.N }, SW, D),
  stringTreePath: count('string.tree-path', 'A tree puts one switch per bit in the path', 'N', { N: Q.N }, PATH, D),
  stringDirectDecoder: count('string.direct-decoder', 'A 1-of-2^N decoder: one gate per output line', '2^N', { N: Q.N }, DEC, CP),
  stringTreeDecoder: count('string.tree-decoder', 'A tree needs one inverter per bit', 'N', { N: Q.N }, DEC, CP),
  r2rResistors: count('r2r.resistors', 'N legs, N − 1 series resistors and one termination', '2 * N', { N: Q.N }, RES, D),
  r2rUnits: count('r2r.units', 'N legs and the termination are 2R; the N − 1 series resistors are R', '(N + 1) * u + (N - 1)', { N: Q.N, u: Q.u }, UNITS, D),
  r2rSwitches: count('r2r.switches', 'One changeover switch per bit', 'N', { N: Q.N }, SW, D),
  segResistors: count('segmented.resistors', '2^M − 1 unary legs, the joint, and an L-bit ladder', '2^M + 2 * L', { M: Q.M, L: Q.L }, RES, D),
  segUnits: count('segmented.units', 'Unary legs, ladder legs and termination are 2R; ladder series and the joint are R', '(2^M - 1 + L + 1) * u + L', { M: Q.M, L: Q.L, u: Q.u }, UNITS, D),
  segSwitches: count('segmented.switches', 'One switch per unary leg and per binary bit', '2^M - 1 + L', { M: Q.M, L: Q.L }, SW, D),
  segDecoder: count('segmented.decoder', 'A thermometer decoder: one gate per unary leg', '2^M - 1', { M: Q.M }, DEC, CP),
  twoStageResistors: count('two-stage.resistors', 'A coarse string of 2^M and a fine string of 2^L resistors', '2^M + 2^L', { M: Q.M, L: Q.L }, RES, D),
  twoStageUnits: count('two-stage.units', 'Each string resistor counts as one unit', '2^M + 2^L', { M: Q.M, L: Q.L }, UNITS, D),
  twoStageSwitches: count('two-stage.switches', 'Two coarse taps per segment and one fine tap per code', '2 * 2^M + 2^L', { M: Q.M, L: Q.L }, SW, D),
  twoStageDecoder: count('two-stage.decoder', 'One decoder line per coarse segment and per fine tap', '2^M + 2^L', { M: Q.M, L: Q.L }, DEC, CP)
}
