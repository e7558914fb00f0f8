/** A per-code series as the engine writes it: bucket start codes with the min and max in each bucket. */
export interface CodeSeries { codes: number[], min: (number | null)[], max: (number | null)[] }

/** Most points a chart draws per series; longer series are merged bucket by bucket. */
export const MAX_CHART_POINTS = 256

/**
 * Decimates a min/max series to at most `maxPoints` buckets without losing extremes: each output
 * bucket keeps the lowest min and the highest max of the input buckets it covers, and starts at
 * the first code it covers. Nulls (not applicable) are skipped; an all-null bucket stays null.
 */
export function decimateMinMax(series: CodeSeries, maxPoints = MAX_CHART_POINTS): CodeSeries {
  const n = series.codes.length
  if (n <= maxPoints) return series
  const size = Math.ceil(n / maxPoints)
  const out: CodeSeries = { codes: [], min: [], max: [] }
  for (let start = 0; start < n; start += size) {
    let lo: number | null = null
    let hi: number | null = null
    for (let i = start; i < Math.min(n, start + size); i++) {
      const a = series.min[i]
      const b = series.max[i]
      if (a !== null && a !== undefined && (lo === null || a < lo)) lo = a
      if (b !== null && b !== undefined && (hi === null || b > hi)) hi = b
    }
    out.codes.push(series.codes[start]!)
    out.min.push(lo)
    out.max.push(hi)
  }
  return out
}

/** Extremes of a series (for the text alternative): lowest min, highest max and where they are. */
export function seriesExtremes(series: CodeSeries): { min: number | null, minCode: number | null, max: number | null, maxCode: number | null } {
  let min: number | null = null
  let max: number | null = null
  let minCode: number | null = null
  let maxCode: number | null = null
  series.codes.forEach((code, i) => {
    const a = series.min[i]
    const b = series.max[i]
    if (a !== null && a !== undefined && (min === null || a < min)) [min, minCode] = [a, code]
    if (b !== null && b !== undefined && (max === null || b > max)) [max, maxCode] = [b, code]
  })
  return { min, minCode, max, maxCode }
}

/** log10 of a positive value for a chart plotted in decades; null (a gap) for zero, negative or missing. */
export function logOrNull(v: number | null | undefined): number | null {
  return v !== null && v !== undefined && v > 0 ? Math.log10(v) : null
}

/** An axis value for its label: rounding noise around zero (|v| < 1e-9 of an LSB-scale axis) reads as 0. */
export function tick(v: number): number {
  return Math.abs(v) < 1e-9 ? 0 : v
}
