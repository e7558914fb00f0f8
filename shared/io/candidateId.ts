import type { NetlistSpecInput } from '../core/contract/netlist'

/** The netlist candidate of an evaluation candidate id (`segmented-m4`, `string-tree`, `two-stage-buffered`…), or null. */
export function netlistCandidateOf(id: string, bits: number): NetlistSpecInput['candidate'] | null {
  if (id === 'r2r-voltage' || id === 'r2r-current') return { topology: id }
  if (id === 'string-direct' || id === 'string-tree') return { topology: 'string', decode: id === 'string-tree' ? 'tree' : 'direct' }
  if (id === 'two-stage-buffered' || id === 'two-stage-unbuffered') return { topology: 'two-stage-string', buffered: id === 'two-stage-buffered' }
  const m = /^segmented-m(\d{1,2})$/.exec(id)
  if (m && Number(m[1]) >= 1 && Number(m[1]) <= bits - 1) return { topology: 'segmented', unaryBits: Number(m[1]) }
  return null
}
