import { create, createUnitDependencies, unitDependencies, type Unit } from 'mathjs'
import { formatNumber, formatSi } from './format'
import { bareScale, spiceRewrite } from './spiceUnits'

/**
 * Engineering notation typed the way engineers write it (`2.5 V`, `10 kΩ`, `1 MS/s`, `0.02 mm^2`,
 * `1 %·µm`, `99.7 %`), parsed with mathjs units into the number a field of the engine contract
 * takes, and written back normalised with SI prefixes.
 */
const math = create({ ...unitDependencies, ...createUnitDependencies })
// Units mathjs lacks: per cent (0.01, dimensionless), samples per second (1/s, with SI prefixes)
// and LSB (a dimension of its own, so a voltage is never taken for LSB).
math.createUnit('percent', { definition: '0.01' })
math.createUnit('sps', { definition: '1 Hz', prefixes: 'short' })
math.createUnit('LSB', { prefixes: 'none' })

/** How one field's value is written: its contract unit and how the interface shows it. */
export interface UnitSpec {
  /** the unit of the contract field, as mathjs text: 'V', 'mm^2', 'percent*um', 'LSB', '' (a plain number) */
  unit: string
  /** what the quantity is called in messages: 'a voltage' */
  quantity: string
  /** the symbol shown: the SI base symbol when `prefixed` ('Ω', 'm', 'S/s'), else the contract unit ('mm²') */
  symbol: string
  /** true: shown with an SI prefix (`640 kΩ`); false: shown in the contract unit (`0.02 mm²`) */
  prefixed: boolean
  /** a plain fraction shown as per cent (`99.7 %`) */
  percent?: boolean
  /** what a valid entry looks like, for messages: '2.5 V' */
  example: string
}

/** A read value, with a note when the reading needs saying (a bare `m` taken as milli). */
export type ParseResult = { ok: true, value: number, note?: string } | { ok: false, message: string }

const REWRITES: [RegExp, string][] = [
  [/[\u00B5\u03BC]/g, 'u'], // micro sign and Greek mu
  [/\u03A9|\u2126/g, 'ohm'],
  [/ohms\b/g, 'ohm'],
  [/\s*\/\s*(?:sq\b|\u25A1)/g, ''], // Ω/□ and ohm/sq: the square is a count, not a unit
  [/\u00B2/g, '^2'],
  [/\u00B3/g, '^3'],
  [/[\u00B7\u22C5\u00D7]/g, '*'],
  [/%/g, ' percent '],
  [/\b([kMG]?)(?:S|Sa|SPS|sps)\/s\b/g, '$1sps'],
  [/\b([kMG]?)SPS\b/g, '$1sps'],
  [/\u2212/g, '-']
]

/** Rewrites the symbols people type into mathjs unit text (`10 kΩ` → `10 kohm`, `1 MS/s` → `1 Msps`). */
export function normaliseUnitText(text: string): string {
  let out = text.trim()
  for (const [pattern, replacement] of REWRITES) out = out.replace(pattern, replacement)
  return out.replace(/\s+/g, ' ').replace(/\s*\*\s*/g, '*').replace(/\*$/, '').trim()
}

/** SI value of one contract unit (`mm^2` → 1e-6, `percent*um` → 1e-8, '' → 1). */
export function unitScale(unit: string): number {
  return unit === '' ? 1 : math.unit(1, unit).value ?? 1
}

const round12 = (x: number) => Number(x.toPrecision(12))

function tryUnit(text: string): Unit | null {
  try {
    return math.unit(text)
  } catch {
    return null
  }
}

function isPlain(u: Unit): boolean {
  return u.units.length === 0
}

function parseMathjs(text: string, normal: string, spec: UnitSpec): ParseResult {
  const parsed = tryUnit(normal)
  if (!parsed || parsed.value === null || !Number.isFinite(parsed.value)) {
    return { ok: false, message: `must be ${spec.quantity} written as a number and a unit, e.g. ${spec.example} (got "${text.trim()}")` }
  }
  if (isPlain(parsed)) return { ok: true, value: round12(parsed.value) }
  const target = spec.unit === '' ? null : math.unit(1, spec.unit)
  const dimensionless = parsed.dimensions.every(d => d === 0)
  if (target ? !parsed.equalBase(target) : !dimensionless) {
    return { ok: false, message: `must be ${spec.quantity} in ${spec.symbol || 'plain numbers'}, e.g. ${spec.example} (got "${text.trim()}")` }
  }
  return { ok: true, value: round12(parsed.value / unitScale(spec.unit)) }
}

/** The SPICE-style reading of an entry mathjs refused (see spiceUnits.ts), or null when it is not one. */
function parseSpice(text: string, normal: string, spec: UnitSpec): ParseResult | null {
  const rewrite = spiceRewrite(normal)
  if (rewrite.refusal) return { ok: false, message: `must be ${spec.quantity}, e.g. ${spec.example}: "${text.trim()}" ${rewrite.refusal}` }
  if (rewrite.text === null) return null
  const [number, unit] = rewrite.text.split(' ') as [string, string]
  const factor = bareScale(unit)
  let result: ParseResult
  if (factor === null) result = parseMathjs(text, rewrite.text, spec)
  else if (!spec.prefixed) return { ok: false, message: `must be ${spec.quantity} in ${spec.symbol || 'plain numbers'} without a scale letter, e.g. ${spec.example} (got "${text.trim()}")` }
  else result = { ok: true, value: round12((Number(number) * factor) / unitScale(spec.unit)) }
  return result.ok && rewrite.note ? { ...result, note: rewrite.note } : result
}

/**
 * Parses `text` into the value of a field in its contract unit. A bare number is taken in that
 * unit; a number with units must have the field's dimension (`2 kohm` is no voltage). Entries
 * mathjs cannot read in that dimension get a second reading as SPICE-style values (`10k`,
 * `4.7K`, `1meg`, `2.5 v`, `10 Kohm`, `50 pVs`).
 */
export function parseQuantity(text: string, spec: UnitSpec): ParseResult {
  const normal = normaliseUnitText(text)
  if (normal === '') return { ok: false, message: `is required: ${spec.quantity}, e.g. ${spec.example}` }
  const first = parseMathjs(text, normal, spec)
  if (first.ok) return first
  return parseSpice(text, normal, spec) ?? first
}

/**
 * What the interface shows back for an entry, so nothing is silently misread: the value as read,
 * normalised (`10k` → "10 kΩ"), with the note when one applies; null when the entry does not read.
 */
export function readBack(text: string, spec: UnitSpec): string | null {
  const r = parseQuantity(text, spec)
  if (!r.ok) return null
  const shown = formatQuantity(r.value, spec)
  return r.note ? `${shown} (${r.note})` : shown
}

/** Writes a contract value normalised: `formatSi` with a prefix, or the contract unit as is. */
export function formatQuantity(value: number | null | undefined, spec: UnitSpec, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—'
  if (spec.percent) return `${formatNumber(value * 100, digits)} %`
  if (spec.prefixed) return formatSi(value * unitScale(spec.unit), spec.symbol, digits)
  return `${formatNumber(value, digits)}${spec.symbol ? ` ${spec.symbol}` : ''}`
}
