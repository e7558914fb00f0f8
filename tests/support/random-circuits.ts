/**
 * Random mismatched circuits of every topology for cross-checks (deterministic from a seed).
 */
import type { SolveInput, Topology } from '#shared/core/contract/solve'

/** mulberry32: small deterministic uniform PRNG in [0, 1). */
export function prng(seed: number): () => number {
  let s = seed >>> 0
  return () => {
    s = (s + 0x6d2b79f5) >>> 0
    let t = s
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

export interface RandomOptions {
  bits: number
  spread?: number
  switchOhm?: number
  unaryBits?: number
  coarseBits?: number
  buffered?: boolean
}

/** Builds one random circuit: every element R·(1 + spread·u), u uniform in [−1, 1]. */
export function randomCircuit(topology: Topology, rand: () => number, o: RandomOptions): SolveInput {
  const spread = o.spread ?? 0.2
  const vals = (n: number, ohm: number) => Array.from({ length: n }, () => ohm * (1 + spread * (2 * rand() - 1)))
  const r = 1000 + 9000 * rand()
  const vrefV = 0.5 + 4 * rand()
  const switchOhm = o.switchOhm ?? 0
  const n = o.bits
  switch (topology) {
    case 'string':
      return { topology, bits: n, vrefV, switchOhm, unitsOhm: vals(2 ** n, r) }
    case 'r2r-voltage':
    case 'r2r-current':
      return { topology, bits: n, vrefV, switchOhm, legsOhm: vals(n, 2 * r), seriesOhm: vals(n - 1, r), terminationOhm: vals(1, 2 * r)[0]! }
    case 'segmented': {
      const m = o.unaryBits ?? 2
      const l = n - m
      return {
        topology, bits: n, vrefV, switchOhm, unaryBits: m, unaryLegsOhm: vals(2 ** m - 1, 2 * r),
        jointOhm: vals(1, r)[0]!, legsOhm: vals(l, 2 * r), seriesOhm: vals(l - 1, r), terminationOhm: vals(1, 2 * r)[0]!
      }
    }
    case 'two-stage-string': {
      const m = o.coarseBits ?? 2
      const buffered = o.buffered ?? false
      const offsets: [number, number] = [0.002 * (2 * rand() - 1), 0.002 * (2 * rand() - 1)]
      return {
        topology, bits: n, vrefV, switchOhm, coarseBits: m, coarseOhm: vals(2 ** m, r / 8),
        fineOhm: vals(2 ** (n - m), r), buffered, ...(buffered ? { bufferOffsetV: offsets } : {})
      }
    }
  }
}
