const PREFIXES: [number, string][] = [[1e12, 'T'], [1e9, 'G'], [1e6, 'M'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'µ'], [1e-9, 'n'], [1e-12, 'p'], [1e-15, 'f']]

/**
 * Engineering notation with an SI prefix, 3 significant figures by default:
 * formatSi(640000, 'Ω') → "640 kΩ", formatSi(3.99e-6, 's') → "3.99 µs".
 */
export function formatSi(value: number | null | undefined, unit: string, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—'
  if (value === 0) return `0 ${unit}`.trim()
  const abs = Math.abs(value)
  const [scale, prefix] = PREFIXES.find(([s]) => abs >= s * 0.9995) ?? PREFIXES[PREFIXES.length - 1]!
  return `${Number((value / scale).toPrecision(digits))} ${prefix}${unit}`.trim()
}

/** A plain number to `digits` significant figures (for units that take no prefix, such as mm²). */
export function formatNumber(value: number | null | undefined, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—'
  return String(Number(value.toPrecision(digits)))
}
