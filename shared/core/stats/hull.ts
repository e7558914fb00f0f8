/**
 * Convex hulls of a monotone point path (x_c = S_c increasing, y_c = c) and support queries:
 * max_c (β·x_c − y_c) and min_c (β·x_c − y_c) for β > 0 in O(log h) per query. Used to find the
 * exact INL extremes of a two-stage string without visiting every code (two-stage.ts).
 */

/** Lower and upper hull vertex indices (into x) per block; block b occupies [start[b], end[b]). */
export interface BlockHulls {
  lower: Int32Array
  upper: Int32Array
  lowerStart: Int32Array
  lowerEnd: Int32Array
  upperStart: Int32Array
  upperEnd: Int32Array
}

/** Buffers for `blocks` blocks over `points` points. */
export function createBlockHulls(points: number, blocks: number): BlockHulls {
  return {
    lower: new Int32Array(points + blocks),
    upper: new Int32Array(points + blocks),
    lowerStart: new Int32Array(blocks),
    lowerEnd: new Int32Array(blocks),
    upperStart: new Int32Array(blocks),
    upperEnd: new Int32Array(blocks)
  }
}

function cross(x: Float64Array, o: number, a: number, b: number): number {
  return (x[a]! - x[o]!) * (b - o) - (a - o) * (x[b]! - x[o]!)
}

function chain(x: Float64Array, from: number, to: number, out: Int32Array, at: number, lower: boolean): number {
  let top = at
  for (let c = from; c < to; c++) {
    while (top - at >= 2) {
      const t = cross(x, out[top - 2]!, out[top - 1]!, c)
      if (lower ? t > 0 : t < 0) {
        break
      }
      top--
    }
    out[top++] = c
  }
  return top
}

/** Builds hulls of the points (x_c, c) for blocks of `size` consecutive c over x[0 … blocks·size). */
export function buildBlockHulls(x: Float64Array, size: number, blocks: number, h: BlockHulls): void {
  let lo = 0
  let up = 0
  for (let b = 0; b < blocks; b++) {
    h.lowerStart[b] = lo
    h.upperStart[b] = up
    lo = chain(x, b * size, (b + 1) * size, h.lower, lo, true)
    up = chain(x, b * size, (b + 1) * size, h.upper, up, false)
    h.lowerEnd[b] = lo
    h.upperEnd[b] = up
  }
}

/** Index c maximising β·x_c − c over block b (β > 0): first lower-hull edge with slope ≥ β. */
export function argMaxSupport(x: Float64Array, h: BlockHulls, b: number, beta: number): number {
  let lo = h.lowerStart[b]!
  let hi = h.lowerEnd[b]! - 1
  const v = h.lower
  while (lo < hi) {
    const mid = (lo + hi) >> 1
    const a = v[mid]!
    const c = v[mid + 1]!
    if ((c - a) >= beta * (x[c]! - x[a]!)) {
      hi = mid
    } else {
      lo = mid + 1
    }
  }
  return v[lo]!
}

/** Index c minimising β·x_c − c over block b (β > 0): first upper-hull edge with slope ≤ β. */
export function argMinSupport(x: Float64Array, h: BlockHulls, b: number, beta: number): number {
  let lo = h.upperStart[b]!
  let hi = h.upperEnd[b]! - 1
  const v = h.upper
  while (lo < hi) {
    const mid = (lo + hi) >> 1
    const a = v[mid]!
    const c = v[mid + 1]!
    if ((c - a) <= beta * (x[c]! - x[a]!)) {
      hi = mid
    } else {
      lo = mid + 1
    }
  }
  return v[lo]!
}
