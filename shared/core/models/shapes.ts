/**
 * Candidate shapes of a trade study (MODELS.md §2): which circuits a spec is compared across.
 * A shape fixes the topology and its split (unary bits, coarse bits, decode, buffering) but no
 * element values; sizing.ts chooses those.
 */
export const TOPOLOGY_NAMES = ['string', 'r2r-voltage', 'r2r-current', 'segmented', 'two-stage-string'] as const
export type TopologyName = typeof TOPOLOGY_NAMES[number]

/** How a 2R element is drawn: two unit resistors in series, or one unit-area element. */
export type TwoRConstruction = 'two-units' | 'single-element'

/** One candidate architecture. `unaryBits` is M for segmented, else null. */
export interface CandidateShape {
  id: string
  topology: TopologyName
  bits: number
  unaryBits: number | null
  /** two-stage string: coarse bits M (L = N − M fine bits); else null */
  coarseBits: number | null
  /** string: 1-of-2^N direct decode or binary switch tree; else null */
  decode: 'direct' | 'tree' | null
  /** two-stage string: buffers between the stages; else null */
  buffered: boolean | null
}

function shape(id: string, topology: TopologyName, bits: number, extra: Partial<CandidateShape> = {}): CandidateShape {
  return { id, topology, bits, unaryBits: null, coarseBits: null, decode: null, buffered: null, ...extra }
}

/** Coarse bits of the two-stage string: the balanced split M = ⌈N/2⌉ (smallest total element count). */
export function twoStageCoarseBits(bits: number): number {
  return Math.ceil(bits / 2)
}

/**
 * Every candidate for the requested topologies, in a stable order: strings (direct, tree),
 * R-2R voltage and current mode, segmented M = 1 … N − 1, two-stage (buffered, unbuffered).
 */
export function candidateShapes(bits: number, topologies: readonly TopologyName[]): CandidateShape[] {
  const want = new Set(topologies)
  const out: CandidateShape[] = []
  if (want.has('string')) {
    out.push(shape('string-direct', 'string', bits, { decode: 'direct' }))
    out.push(shape('string-tree', 'string', bits, { decode: 'tree' }))
  }
  if (want.has('r2r-voltage')) {
    out.push(shape('r2r-voltage', 'r2r-voltage', bits))
  }
  if (want.has('r2r-current')) {
    out.push(shape('r2r-current', 'r2r-current', bits))
  }
  if (want.has('segmented')) {
    for (let m = 1; m < bits; m++) {
      out.push(shape(`segmented-m${m}`, 'segmented', bits, { unaryBits: m }))
    }
  }
  if (want.has('two-stage-string')) {
    const coarseBits = twoStageCoarseBits(bits)
    out.push(shape('two-stage-buffered', 'two-stage-string', bits, { coarseBits, buffered: true }))
    out.push(shape('two-stage-unbuffered', 'two-stage-string', bits, { coarseBits, buffered: false }))
  }
  return out
}

/** L: binary bits of a segmented shape or fine bits of a two-stage shape (0 otherwise). */
export function lowBits(s: CandidateShape): number {
  if (s.unaryBits !== null) {
    return s.bits - s.unaryBits
  }
  return s.coarseBits !== null ? s.bits - s.coarseBits : 0
}

/**
 * Coarse-to-fine element ratio of the two-stage string: buffered stages use equal units; the
 * unbuffered fine string hangs across one coarse resistor, so coarse elements are made 2^L
 * times smaller than fine ones, keeping the loading error at the boundaries near 2^−L LSB
 * (MODELS.md §2.5: boundary DNL ≈ R_c/R_f) [CP design rule].
 */
export function coarseToFineRatio(s: CandidateShape): number {
  return s.buffered === false ? 2 ** -lowBits(s) : 1
}
