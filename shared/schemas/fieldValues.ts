import type { z } from 'zod'
import { evaluateOptionsSchema, evaluateProcessSchema, evaluateSpecSchema } from '../core/contract/evaluate'
import { formatQuantity, parseQuantity, readBack } from '../utils/units'
import { sectionFields, type FieldDef, type FieldSection } from './fields'

/** What a field holds while it is being edited: text, a flag or a list of choices. */
export type FieldEntry = string | boolean | string[]
export type SectionEntries = Record<string, FieldEntry>
export type FieldResult = { ok: true, value: unknown } | { ok: false, message: string }

/** The engine's schema for each section: the only source of ranges. */
export const SECTION_SCHEMAS = { spec: evaluateSpecSchema, process: evaluateProcessSchema, options: evaluateOptionsSchema } as const

/** The engine's zod schema of one field. */
export function fieldSchema(def: FieldDef): z.ZodType {
  return (SECTION_SCHEMAS[def.section].shape as Record<string, z.ZodType>)[def.key]!
}

interface NumberLike { minValue: number | null, maxValue: number | null, isInt?: boolean, _zod: { def: { type: string, checks?: { _zod: { def: { check?: string, inclusive?: boolean } } }[], innerType?: unknown, options?: unknown[] } } }

function numberSchema(schema: unknown): NumberLike | null {
  let s = schema as NumberLike | undefined
  while (s && s._zod.def.type !== 'number') {
    const def = s._zod.def
    s = (def.innerType ?? def.options?.find(o => (o as NumberLike)._zod.def.type === 'number')) as NumberLike | undefined
  }
  return s ?? null
}

/** The allowed range of a numeric field, read from the engine's schema. */
export function fieldRange(def: FieldDef): { min: number | null, max: number | null, minExclusive: boolean } | null {
  const n = numberSchema(fieldSchema(def))
  if (!n) return null
  const minExclusive = (n._zod.def.checks ?? []).some(c => c._zod.def.check === 'greater_than' && c._zod.def.inclusive === false)
  return { min: n.minValue, max: n.maxValue, minExclusive }
}

/** "from 100 mV to 50 V" / "above 0 and at most 1 nV·s", in the units the interface shows. */
export function rangeText(def: FieldDef): string {
  const range = fieldRange(def)
  if (!range) return ''
  const show = (v: number | null) => v === null ? '' : def.kind === 'quantity' ? formatQuantity(v, def.units, 6) : String(v)
  if (range.min === null) return `at most ${show(range.max)}`
  if (range.max === null) return `${range.minExclusive ? 'above' : 'at least'} ${show(range.min)}`
  return range.minExclusive ? `above ${show(range.min)} and at most ${show(range.max)}` : `from ${show(range.min)} to ${show(range.max)}`
}

function parseEntry(def: FieldDef, entry: FieldEntry): FieldResult {
  if (def.kind === 'flag') return { ok: true, value: entry === true }
  if (def.kind === 'multi') return { ok: true, value: Array.isArray(entry) ? entry : [] }
  const text = typeof entry === 'string' ? entry.trim() : ''
  if (def.kind === 'choice') return { ok: true, value: text }
  if (def.kind === 'integer') {
    const bare = text.replace(new RegExp(`\\s*${def.suffix ?? '$^'}s?$`), '')
    if (!/^[-+]?\d+$/.test(bare)) return { ok: false, message: `must be a whole number ${rangeText(def)}${text ? ` (got "${text}")` : ''}` }
    return { ok: true, value: Number(bare) }
  }
  if (def.nullWord && (text === '' || text.toLowerCase() === def.nullWord)) return { ok: true, value: null }
  if (def.autoWord && text.toLowerCase() === def.autoWord) return { ok: true, value: def.autoWord }
  const parsed = parseQuantity(text, def.units)
  return parsed.ok ? parsed : { ok: false, message: parsed.message }
}

/**
 * Reads one field as the engine wants it: parses the units, then validates with the engine's own
 * schema; a failure message names the allowed range in the units shown.
 */
export function readField(def: FieldDef, entry: FieldEntry): FieldResult {
  const parsed = parseEntry(def, entry)
  if (!parsed.ok) return parsed
  const checked = fieldSchema(def).safeParse(parsed.value)
  if (checked.success) return { ok: true, value: checked.data }
  const range = rangeText(def)
  if (range && typeof parsed.value === 'number') {
    const got = def.kind === 'quantity' ? formatQuantity(parsed.value, def.units, 6) : String(parsed.value)
    return { ok: false, message: `must be ${def.kind === 'integer' ? 'an integer ' : ''}${range} (got ${got})` }
  }
  return { ok: false, message: checked.error.issues[0]?.message ?? 'is not valid' }
}

/**
 * What a typed entry reads as, for showing back beside the field so nothing is silently misread
 * (`10k` → "10 kΩ"; a bare `m` adds "m read as milli …"); null for non-quantities and unreadable text.
 */
export function fieldReadBack(def: FieldDef, entry: FieldEntry): string | null {
  if (def.kind !== 'quantity' || typeof entry !== 'string' || entry.trim() === '') return null
  if ((def.nullWord && entry.trim().toLowerCase() === def.nullWord) || (def.autoWord && entry.trim().toLowerCase() === def.autoWord)) return null
  return readBack(entry, def.units)
}

/** Writes a stored value back as the entry the form shows (normalised units). */
export function writeField(def: FieldDef, value: unknown): FieldEntry {
  if (def.kind === 'flag') return value === true
  if (def.kind === 'multi') return Array.isArray(value) ? value.map(String) : []
  if (value === null || value === undefined) return def.kind === 'quantity' && def.nullWord ? '' : ''
  if (def.kind === 'quantity' && typeof value === 'number') return formatQuantity(value, def.units, 6)
  return String(value)
}

/** Reads every field of a section: the values (defaults from the engine schema) and the errors by key. */
export function readSection(section: FieldSection, entries: SectionEntries): { values: Record<string, unknown>, errors: Record<string, string> } {
  const values: Record<string, unknown> = {}
  const errors: Record<string, string> = {}
  for (const def of sectionFields(section)) {
    const result = readField(def, entries[def.key] ?? '')
    if (result.ok) values[def.key] = result.value
    else errors[def.key] = result.message
  }
  return { values, errors }
}

/** Entries for a section from stored values (missing values fall back to the engine default, if any). */
export function writeSection(section: FieldSection, values: Record<string, unknown> | null | undefined): SectionEntries {
  const entries: SectionEntries = {}
  for (const def of sectionFields(section)) {
    let value = values?.[def.key]
    if (value === undefined) {
      const fallback = fieldSchema(def).safeParse(undefined)
      value = fallback.success ? fallback.data : undefined
    }
    entries[def.key] = writeField(def, value)
  }
  return entries
}

/** A stored value as a person reads it: normalised units, choice labels, "none", "yes"/"no". */
export function showField(def: FieldDef, value: unknown): string {
  if (value === undefined) return '—'
  if (def.kind === 'flag') return value === true ? 'yes' : 'no'
  if (def.kind === 'multi') return Array.isArray(value) ? value.map(v => def.choices.find(c => c.value === v)?.label ?? String(v)).join(', ') : '—'
  if (def.kind === 'choice') return def.choices.find(c => c.value === value)?.label ?? String(value)
  if (value === null) return def.kind === 'quantity' && def.nullWord ? def.nullWord : '—'
  if (def.kind === 'integer') return `${String(value)}${def.suffix ? ` ${def.suffix}` : ''}`
  return typeof value === 'number' ? formatQuantity(value, def.units, 4) : String(value)
}
