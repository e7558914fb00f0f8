import { formatNumber, formatSi } from './format'

/** Unit of a candidate metric from its name's SI suffix (the contract puts units in names). */
const SUFFIXES: [RegExp, (v: number) => string][] = [
  [/Yield$/, v => `${formatNumber(v * 100, 4)} %`],
  [/Mm2$/, v => `${formatNumber(v)} mm²`],
  [/Um2$/, v => `${formatNumber(v)} µm²`],
  [/Lsb$/, v => `${formatNumber(v)} LSB`],
  [/Vs$/, v => formatSi(v, 'V·s')],
  [/Ohm$/, v => formatSi(v, 'Ω')],
  [/Vrms$/, v => formatSi(v, 'V rms')],
  [/Hz$/, v => formatSi(v, 'Hz')],
  [/W$/, v => formatSi(v, 'W')],
  [/A$/, v => formatSi(v, 'A')],
  [/S$/, v => formatSi(v, 's')]
]

/** A candidate metric written with its unit (`routMaxOhm` 12500 → "12.5 kΩ"); counts and codes stay plain. */
export function formatMetric(name: string, value: number | null): string {
  if (value === null) return '—'
  const match = SUFFIXES.find(([pattern]) => pattern.test(name))
  return match ? match[1](value) : formatNumber(value, 6)
}
