/**
 * Formats substituted into finding messages: `{metrics.totalAreaMm2|mm2}` → "0.0236 mm²".
 * Engineering units with SI prefixes (3 significant figures), as everywhere in the interface.
 */
import { formatNumber, formatSi } from '../utils/format'

type Formatter = (value: unknown) => string

function num(f: (v: number) => string): Formatter {
  return v => (typeof v === 'number' && Number.isFinite(v) ? f(v) : '—')
}

export const FORMATS: Record<string, Formatter> = {
  num: num(v => formatNumber(v)),
  int: num(v => String(Math.round(v))),
  pct: num(v => `${formatNumber(v * 100)} %`),
  yield: num(v => `${Number((v * 100).toFixed(v >= 0.999 ? 3 : 2))} %`),
  x: num(v => `${formatNumber(v)}×`),
  lsb: num(v => `${formatNumber(v)} LSB`),
  bits: num(v => `${Math.round(v)} bits`),
  mm2: num(v => `${formatNumber(v)} mm²`),
  um2: num(v => `${formatNumber(v)} µm²`),
  um: num(v => `${formatNumber(v)} µm`),
  ohm: num(v => formatSi(v, 'Ω')),
  v: num(v => formatSi(v, 'V')),
  a: num(v => formatSi(v, 'A')),
  w: num(v => formatSi(v, 'W')),
  s: num(v => formatSi(v, 's')),
  hz: num(v => formatSi(v, 'Hz')),
  vs: num(v => formatSi(v, 'V·s')),
  f: num(v => formatSi(v, 'F')),
  c: num(v => formatSi(v, 'C')),
  text: v => (v === null || v === undefined ? '—' : String(v))
}

export const FORMAT_NAMES = Object.keys(FORMATS)
