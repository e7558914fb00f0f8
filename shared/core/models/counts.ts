/**
 * Element counts per candidate (MODELS.md §3). Decoder gates are counted as one logic gate per
 * decoded output line (1-of-n and thermometer decoders) plus one inverter per bit for a
 * switch tree [CP model for ranking; real decoders share terms].
 */
import type { Formula } from '../explain/define'
import { COUNT_FORMULAS } from '../explain/registry'
import type { Trace } from '../explain/types'
import type { CandidateShape, TwoRConstruction } from './shapes'
import { lowBits } from './shapes'

/** Counts of one candidate; `switchesInPath` is the number of switches between a tap and the output. */
export interface ElementCounts {
  resistorCount: number
  unitResistorCount: number
  switchCount: number
  switchesInPath: number
  decoderGateCount: number
  bufferCount: number
}

type CountKey = Exclude<keyof ElementCounts, 'bufferCount'>

function fixed(trace: Trace | undefined, key: CountKey | 'bufferCount', value: number): number {
  if (trace) {
    trace[key] = { kind: 'procedure', procedure: 'topology-constant', inputs: {}, result: value }
  }
  return value
}

function counted(rows: [CountKey, Formula][], inputs: Record<string, number>, trace: Trace | undefined, rest: Partial<ElementCounts>): ElementCounts {
  const out: Record<string, number> = { ...rest }
  for (const [key, f] of rows) {
    out[key] = f.use(inputs, trace, key)
  }
  return out as unknown as ElementCounts
}

/** Element, unit, switch, decoder and buffer counts of a candidate, each through its registry formula. */
export function elementCounts(s: CandidateShape, twoR: TwoRConstruction = 'two-units', trace?: Trace): ElementCounts {
  const F = COUNT_FORMULAS
  const N = s.bits
  const u = twoR === 'two-units' ? 2 : 1
  switch (s.topology) {
    case 'string': {
      const tree = s.decode === 'tree'
      return counted([
        ['resistorCount', F.stringResistors], ['unitResistorCount', F.stringUnits],
        ['switchCount', tree ? F.stringTreeSwitches : F.stringDirectSwitches],
        ['decoderGateCount', tree ? F.stringTreeDecoder : F.stringDirectDecoder],
        ...(tree ? [['switchesInPath', F.stringTreePath] as [CountKey, Formula]] : [])
      ], { N }, trace, { ...(tree ? {} : { switchesInPath: fixed(trace, 'switchesInPath', 1) }), bufferCount: fixed(trace, 'bufferCount', 0) })
    }
    case 'r2r-voltage':
    case 'r2r-current':
      return counted([['resistorCount', F.r2rResistors], ['unitResistorCount', F.r2rUnits], ['switchCount', F.r2rSwitches]], { N, u }, trace, {
        switchesInPath: fixed(trace, 'switchesInPath', 1), decoderGateCount: fixed(trace, 'decoderGateCount', 0), bufferCount: fixed(trace, 'bufferCount', 0)
      })
    case 'segmented':
      return counted([['resistorCount', F.segResistors], ['unitResistorCount', F.segUnits], ['switchCount', F.segSwitches], ['decoderGateCount', F.segDecoder]],
        { M: s.unaryBits ?? 1, L: lowBits(s), u }, trace, { switchesInPath: fixed(trace, 'switchesInPath', 1), bufferCount: fixed(trace, 'bufferCount', 0) })
    case 'two-stage-string':
      return counted([['resistorCount', F.twoStageResistors], ['unitResistorCount', F.twoStageUnits], ['switchCount', F.twoStageSwitches], ['decoderGateCount', F.twoStageDecoder]],
        { M: s.coarseBits ?? 1, L: lowBits(s) }, trace, { switchesInPath: fixed(trace, 'switchesInPath', 1), bufferCount: fixed(trace, 'bufferCount', s.buffered ? 2 : 0) })
  }
}
