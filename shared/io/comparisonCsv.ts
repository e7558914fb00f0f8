import { REQUIRED_METRICS, type EvaluateOutput } from '../core/contract/evaluate-output'

/** Unit of a metric from its name's SI suffix (the contract puts units in names), for a CSV header. */
const UNITS: [RegExp, string][] = [
  [/Yield$/, 'fraction'], [/Mm2$/, 'mm²'], [/Um2$/, 'µm²'], [/Lsb$/, 'LSB'], [/Vs$/, 'V·s'], [/Ohm$/, 'Ω'],
  [/Vrms$/, 'V rms'], [/Hz$/, 'Hz'], [/W$/, 'W'], [/A$/, 'A'], [/S$/, 's'], [/Count$/, 'count'], [/Code$/, 'code']
]

export function metricHeader(name: string): string {
  const unit = UNITS.find(([p]) => p.test(name))?.[1]
  return unit ? `${name} (${unit})` : name
}

/**
 * The comparison as rows: one per candidate, in the output's order (its ranking), with the
 * contract's numbers (SI units, named in the header) and the recommendation.
 */
export function comparisonRows(results: EvaluateOutput & { recommendedId?: string | null }): unknown[][] {
  const extra = [...new Set(results.candidates.flatMap(c => Object.keys(c.metrics)))]
    .filter(k => !(REQUIRED_METRICS as readonly string[]).includes(k) && results.candidates.every(c => typeof c.metrics[k] !== 'object' || c.metrics[k] === null))
  const metrics = [...REQUIRED_METRICS, ...extra]
  const header = ['candidate', 'topology', 'unaryBits', 'recommended', 'meetsSpec', 'failing', ...metrics.map(metricHeader)]
  const body = results.candidates.map(c => [
    c.id, c.topology, c.unaryBits, c.id === results.recommendedId ? 'yes' : 'no', c.meetsSpec ? 'yes' : 'no', c.failing.join(' '),
    ...metrics.map(k => c.metrics[k] ?? '')
  ])
  return [header, ...body]
}
