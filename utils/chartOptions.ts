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
  yLog?: boolean
  xType?: 'numeric' | 'category'
  format: (v: number) => string
  xFormat?: (v: number) => string
  /** fill opacity per series: light bands for envelopes, none for lines */
  fillOpacity?: number | number[]
  strokeWidth?: number | number[]
}

const axisStyle = { colors: CHART_INK.muted, fontFamily: CHART_INK.font, fontSize: '11px' }
const titleStyle = { color: CHART_INK.text, fontFamily: CHART_INK.font, fontSize: '11px', fontWeight: 400 }

function yAxis(title: string, i: number, f: Frame): ChartYAxis {
  return { opposite: i > 0, logarithmic: i === 0 && f.yLog, title: { text: title, style: titleStyle }, labels: { style: axisStyle, formatter: (v: number) => f.format(v) } }
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
    tooltip: { theme: 'light', x: { formatter: (v: number) => (f.xFormat ?? String)(v) }, y: { formatter: (v: number) => f.format(v) } },
    xaxis: {
      type: f.xType ?? 'numeric',
      title: { text: f.xTitle, style: titleStyle },
      labels: { style: axisStyle, formatter: (v: string) => (f.xFormat ? f.xFormat(Number(v)) : String(Math.round(Number(v)))) },
      tickAmount: 8
    },
    // A single axis goes in as an object: as an array, apex gives the other series axes of their own.
    yaxis: yTitles.length === 1 ? yAxis(yTitles[0]!, 0, f) : yTitles.map((t, i) => yAxis(t, i, f)),
    annotations: {
      yaxis: (f.limits ?? []).map(l => ({
        y: l.y,
        yAxisIndex: l.yAxisIndex ?? 0,
        borderColor: CHART_INK.limit,
        strokeDashArray: 5,
        label: { text: l.label, borderWidth: 0, style: { color: CHART_INK.limit, background: 'transparent', fontFamily: CHART_INK.font, fontSize: '10px' } }
      }))
    }
  }
}
