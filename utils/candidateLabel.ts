import type { EvaluateCandidate } from '#shared/core/contract/evaluate'

/** A person's name for a candidate: "Segmented, 5 unary bits", "Two-stage string, buffered". */
export function candidateLabel(c: EvaluateCandidate): string {
  const extra = c as { decode?: string | null, buffered?: boolean | null, coarseBits?: number | null }
  switch (c.topology) {
    case 'string': return extra.decode === 'tree' ? 'String, tree decode' : 'String, direct decode'
    case 'r2r-voltage': return 'R-2R, voltage mode'
    case 'r2r-current': return 'R-2R, current mode'
    case 'segmented': return `Segmented, ${c.unaryBits} unary bit${c.unaryBits === 1 ? '' : 's'}`
    default: return `Two-stage string, ${extra.buffered ? 'buffered' : 'unbuffered'}`
  }
}
