/**
 * Element counts per candidate (MODELS.md §3). Decoder gates are counted as one logic gate per
 * decoded output line (1-of-n and thermometer decoders) plus one inverter per bit for a
 * switch tree [CP model for ranking; real decoders share terms].
 */
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

/** Element, unit, switch, decoder and buffer counts of a candidate. */
export function elementCounts(s: CandidateShape, twoR: TwoRConstruction = 'two-units'): ElementCounts {
  const n = s.bits
  const per2R = twoR === 'two-units' ? 2 : 1
  switch (s.topology) {
    case 'string': {
      const tree = s.decode === 'tree'
      return {
        resistorCount: 2 ** n,
        unitResistorCount: 2 ** n,
        switchCount: tree ? 2 ** (n + 1) - 2 : 2 ** n,
        switchesInPath: tree ? n : 1,
        decoderGateCount: tree ? n : 2 ** n,
        bufferCount: 0
      }
    }
    case 'r2r-voltage':
    case 'r2r-current':
      // N legs (2R) + N − 1 series (R) + termination (2R)
      return { resistorCount: 2 * n, unitResistorCount: (n + 1) * per2R + (n - 1), switchCount: n, switchesInPath: 1, decoderGateCount: 0, bufferCount: 0 }
    case 'segmented': {
      const m = s.unaryBits ?? 1
      const l = lowBits(s)
      const legs = 2 ** m - 1
      return {
        resistorCount: 2 ** m + 2 * l,
        // unary legs and ladder legs and termination are 2R; ladder series and the joint are R
        unitResistorCount: (legs + l + 1) * per2R + l,
        switchCount: legs + l,
        switchesInPath: 1,
        decoderGateCount: legs,
        bufferCount: 0
      }
    }
    case 'two-stage-string': {
      const m = s.coarseBits ?? 1
      const l = lowBits(s)
      return {
        resistorCount: 2 ** m + 2 ** l,
        unitResistorCount: 2 ** m + 2 ** l,
        switchCount: 2 * 2 ** m + 2 ** l,
        switchesInPath: 1,
        decoderGateCount: 2 ** m + 2 ** l,
        bufferCount: s.buffered ? 2 : 0
      }
    }
  }
}
