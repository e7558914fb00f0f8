/**
 * Independent reference for tests: dense modified nodal analysis by Gaussian elimination with
 * partial pivoting, over a plain list of resistors. Written separately from the engine's
 * solvers (no tridiagonal tricks, no superposition) so that agreement means something.
 */

export interface Resistor {
  a: string
  b: string
  ohm: number
}

export interface NodalSolution {
  /** node voltage (V); fixed nodes return their fixed value */
  v: (node: string) => number
  /** current (A) flowing out of `node` into the resistors attached to it */
  currentOut: (node: string) => number
}

/** Solves A x = b in place (A row-major n×n) with partial pivoting. */
export function gaussSolve(a: number[][], b: number[]): number[] {
  const n = b.length
  for (let col = 0; col < n; col++) {
    let piv = col
    for (let r = col + 1; r < n; r++) {
      if (Math.abs(a[r]![col]!) > Math.abs(a[piv]![col]!)) piv = r
    }
    ;[a[col], a[piv]] = [a[piv]!, a[col]!]
    ;[b[col], b[piv]] = [b[piv]!, b[col]!]
    for (let r = col + 1; r < n; r++) {
      const f = a[r]![col]! / a[col]![col]!
      if (f === 0) continue
      for (let c = col; c < n; c++) a[r]![c]! -= f * a[col]![c]!
      b[r]! -= f * b[col]!
    }
  }
  const x = new Array<number>(n).fill(0)
  for (let r = n - 1; r >= 0; r--) {
    let s = b[r]!
    for (let c = r + 1; c < n; c++) s -= a[r]![c]! * x[c]!
    x[r] = s / a[r]![r]!
  }
  return x
}

interface Assembled {
  index: Map<string, number>
  a: number[][]
  b: number[]
}

/** Conductance matrix and source vector over the free (non-fixed) nodes. */
function assemble(resistors: Resistor[], fixedAll: Record<string, number>, inject: Record<string, number>): Assembled {
  const index = new Map<string, number>()
  for (const r of resistors) {
    for (const n of [r.a, r.b]) {
      if (!(n in fixedAll) && !index.has(n)) index.set(n, index.size)
    }
  }
  const m = index.size
  const a = Array.from({ length: m }, () => new Array<number>(m).fill(0))
  const b = new Array<number>(m).fill(0)
  for (const [node, i] of Object.entries(inject)) {
    const k = index.get(node)
    if (k !== undefined) b[k]! += i
  }
  for (const r of resistors) {
    const g = 1 / r.ohm
    const ia = index.get(r.a)
    const ib = index.get(r.b)
    if (ia !== undefined) a[ia]![ia]! += g
    if (ib !== undefined) a[ib]![ib]! += g
    if (ia !== undefined && ib !== undefined) {
      a[ia]![ib]! -= g
      a[ib]![ia]! -= g
    } else if (ia !== undefined) {
      b[ia]! += g * fixedAll[r.b]!
    } else if (ib !== undefined) {
      b[ib]! += g * fixedAll[r.a]!
    }
  }
  return { index, a, b }
}

/**
 * Node voltages of a resistor network with some nodes fixed by ideal sources ('0' is ground)
 * and optional current injections (A, into the node).
 */
export function solveNodal(
  resistors: Resistor[],
  fixed: Record<string, number>,
  inject: Record<string, number> = {}
): NodalSolution {
  const fixedAll: Record<string, number> = { 0: 0, ...fixed }
  const { index, a, b } = assemble(resistors, fixedAll, inject)
  const x = b.length > 0 ? gaussSolve(a, b) : []
  const v = (node: string): number => {
    if (node in fixedAll) return fixedAll[node]!
    const k = index.get(node)
    if (k === undefined) throw new Error(`unknown node ${node}`)
    return x[k]!
  }
  const currentOut = (node: string): number => {
    let s = 0
    for (const r of resistors) {
      if (r.a === node) s += (v(r.a) - v(r.b)) / r.ohm
      else if (r.b === node) s += (v(r.b) - v(r.a)) / r.ohm
    }
    return s
  }
  return { v, currentOut }
}
