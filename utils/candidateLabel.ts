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

/** The same name from a candidate id alone (`segmented-m4` → "Segmented, 4 unary bits"); an unknown id is returned as it is. */
export function candidateLabelOfId(id: string): string {
  const fixed: Record<string, string> = {
    'string-direct': 'String, direct decode', 'string-tree': 'String, tree decode', 'r2r-voltage': 'R-2R, voltage mode',
    'r2r-current': 'R-2R, current mode', 'two-stage-buffered': 'Two-stage string, buffered', 'two-stage-unbuffered': 'Two-stage string, unbuffered'
  }
  const m = /^segmented-m(\d+)$/.exec(id)
  if (m) return `Segmented, ${m[1]} unary bit${m[1] === '1' ? '' : 's'}`
  return fixed[id] ?? id
}
