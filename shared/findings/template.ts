/**
 * Message templates: `{fact.field|format}` placeholders, e.g. `{metrics.totalAreaMm2|mm2}`.
 * Checked when a pack loads (known fact, field and format), rendered per candidate.
 */
import { isKnownField } from './fields'
import { FORMATS } from './format'

const PLACEHOLDER = /\{([a-zA-Z]+)\.([a-zA-Z0-9]+)(?:\|([a-z0-9]+))?\}/g

export interface Placeholder { fact: string, field: string, format: string | undefined }

/** Every placeholder in a template, in order. */
export function placeholders(template: string): Placeholder[] {
  return [...template.matchAll(PLACEHOLDER)].map(m => ({ fact: m[1]!, field: m[2]!, format: m[3] }))
}

/** The first problem with a template's placeholders, or null when all are known. */
export function templateProblem(template: string): string | null {
  for (const p of placeholders(template)) {
    if (!isKnownField(p.fact, p.field)) return `placeholder {${p.fact}.${p.field}} names an unknown field`
    if (p.format !== undefined && !(p.format in FORMATS)) {
      return `placeholder {${p.fact}.${p.field}|${p.format}} uses an unknown format; use one of ${Object.keys(FORMATS).join(', ')}`
    }
  }
  const stray = template.replace(PLACEHOLDER, '').match(/\{[^}]*\}/)
  return stray ? `${stray[0]} is not a placeholder; write {fact.field|format}, e.g. {metrics.totalAreaMm2|mm2}` : null
}

/** Substitutes the facts into a template. */
export function renderTemplate(template: string, facts: Record<string, Record<string, unknown>>): string {
  return template.replace(PLACEHOLDER, (_all, fact: string, field: string, format?: string) => {
    const value = facts[fact]?.[field]
    const f = FORMATS[format ?? (typeof value === 'number' ? 'num' : 'text')] ?? FORMATS.text!
    return f(value)
  })
}
