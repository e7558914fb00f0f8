import tokens from '~~/tailwind.config'

const c = tokens.theme.extend.colors

/** Chart ink for axes, grid and spec limits (the same token values Tailwind classes use). */
export const CHART_INK = { text: c.ink.DEFAULT, grid: c.rule, muted: c.slate.DEFAULT, limit: c.fail, accent: c.copper.DEFAULT, font: tokens.theme.extend.fontFamily.sans.join(', ') }

/** One hue per candidate, in this order: ink, copper, slate first, then the chart tokens. */
export const CANDIDATE_HUES: readonly string[] = [
  c.ink.DEFAULT, c.copper.DEFAULT, c.slate.DEFAULT, c.chart.teal, c.chart.plum, c.chart.moss,
  c.chart.steel, c.chart.brick, c.chart.sand, c.chart.olive, c.ink.soft, c.copper.ink
]

/**
 * The hue of each candidate by its place in the study's candidate list, so a candidate keeps its
 * colour in every chart (the list order is the engine's, stable for given topologies).
 */
export function candidateHues(ids: readonly string[]): Record<string, string> {
  return Object.fromEntries(ids.map((id, i) => [id, CANDIDATE_HUES[i % CANDIDATE_HUES.length]!]))
}
