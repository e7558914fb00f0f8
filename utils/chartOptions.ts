import type { ApexOptions } from 'apexcharts'
import { CHART_INK } from './chartPalette'

/** One y axis of the options (apexcharts does not export the type by name). */
export type ChartYAxis = Exclude<NonNullable<ApexOptions['yaxis']>, unknown[]>

/** A dashed spec limit across the chart. */
export interface ChartLimit { y: number, label: string, yAxisIndex?: number }

interface Frame {
  xTitle: string
  yTitle: string | string[]
  colors: string[]
  limits?: ChartLimit[]
  /**
   * 'log10': the series carry log10 of the values (labels, tooltips and limits convert), which keeps
   * every series on one scale; 'native': apex's own log axis (one series per axis only)
   */
  yLog?: 'log10' | 'native'
  xType?: 'numeric' | 'category'
  format: (v: number) => string
  xFormat?: (v: number) => string
  /** fill opacity per series: light bands for envelopes, none for lines */
  fillOpacity?: number | number[]
  strokeWidth?: number | number[]
  yMin?: number
  yMax?: number
}

const axisStyle = { colors: CHART_INK.muted, fontFamily: CHART_INK.font, fontSize: '11px' }
const titleStyle = { color: CHART_INK.text, fontFamily: CHART_INK.font, fontSize: '11px', fontWeight: 400 }

/** Converts a plotted value back to the quantity (plotted as log10 when `yLog` is 'log10'). */
const unplot = (f: Frame) => (v: number) => (f.yLog === 'log10' ? 10 ** v : v)
/** A quantity as plotted. */
export const plotted = (log: boolean, v: number) => (log ? Math.log10(v) : v)

function yAxis(title: string, i: number, f: Frame): ChartYAxis {
  const log = f.yLog === 'log10'
  const lim = (v: number | undefined) => (v === undefined || i > 0 ? undefined : plotted(log, v))
  return {
    opposite: i > 0,
    logarithmic: i === 0 && f.yLog === 'native',
    min: lim(f.yMin),
    max: lim(f.yMax),
    title: { text: title, style: titleStyle },
    labels: { style: axisStyle, formatter: (v: number) => f.format(i === 0 ? unplot(f)(v) : v) }
  }
}

/** Options every Rungwise chart shares: thin lines, our type and tokens, no built-in legend or toolbar, dashed spec limits. */
export function chartOptions(f: Frame): ApexOptions {
  const yTitles = Array.isArray(f.yTitle) ? f.yTitle : [f.yTitle]
  return {
    chart: { fontFamily: CHART_INK.font, foreColor: CHART_INK.muted, toolbar: { show: false }, zoom: { enabled: false }, animations: { enabled: false }, background: 'transparent',
      // the chart is aria-hidden: its text alternative is the table beside it, so no focusable parts;
      // series arrive decimated by utils/chartSeries.ts (extremes kept), so no second reduction
      accessibility: { enabled: false, keyboard: { enabled: false } }, dataReducer: { enabled: false } },
    colors: f.colors,
    stroke: { width: f.strokeWidth ?? 1.5, curve: 'straight' },
    fill: { opacity: f.fillOpacity ?? 1 },
    markers: { size: 0 },
    dataLabels: { enabled: false },
    legend: { show: false },
    grid: { borderColor: CHART_INK.grid, strokeDashArray: 2 },
    tooltip: { theme: 'light', x: { formatter: (v: number) => (f.xFormat ?? String)(v) }, y: { formatter: (v: number) => f.format(unplot(f)(v)) } },
    xaxis: {
      type: f.xType ?? 'numeric',
      title: { text: f.xTitle, style: titleStyle },
      labels: { style: axisStyle, formatter: (v: string) => (f.xFormat ? f.xFormat(Number(v)) : String(Math.round(Number(v)))) },
      tickAmount: 6
    },
    // always an array: apex 7 drops the label formatter of a yaxis given as a single object
    yaxis: yTitles.map((t, i) => yAxis(t, i, f)),
    annotations: {
      yaxis: (f.limits ?? []).map(l => ({
        y: plotted(f.yLog === 'log10' && (l.yAxisIndex ?? 0) === 0, l.y),
        yAxisIndex: l.yAxisIndex ?? 0,
        borderColor: CHART_INK.limit,
        strokeDashArray: 5,
        label: { text: l.label, borderWidth: 0, style: { color: CHART_INK.limit, background: 'transparent', fontFamily: CHART_INK.font, fontSize: '10px' } }
      }))
    }
  }
}
