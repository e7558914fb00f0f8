/**
 * A rule's conditions in words, for the rule-pack editor: the stored form is json-rules-engine's
 * (`{ fact: 'metrics', path: '$.totalAreaMm2', operator: 'greaterThan', value: 0.01 }`); a person
 * reads "Result: total area is above 0.01". The stored format does not change.
 */
import type { Condition } from './schema'
import { FACT_WORDS, factLabel } from './labels'
import type { FactName } from './fields'
import { findField, type FieldSection } from '../schemas/fields'
import { formatQuantity } from '../utils/units'
import { formatMetric } from '../utils/metricFormat'

export const OPERATOR_WORDS: Record<string, string> = {
  equal: 'is', notEqual: 'is not', lessThan: 'is below', lessThanInclusive: 'is at most', greaterThan: 'is above',
  greaterThanInclusive: 'is at least', in: 'is one of', notIn: 'is none of'
}

const fieldOf = (path: string) => path.replace(/^\$\./, '')

/** "Result: total area" for `{ fact: 'metrics', path: '$.totalAreaMm2' }`. */
export function factWords(fact: string, path: string): string {
  return `${FACT_WORDS[fact as FactName] ?? fact}: ${factLabel(fact, fieldOf(path))}`
}

/** A number in the unit of the field it is compared with: the catalogue's for inputs, the name's SI suffix for results. */
function numberWords(value: number, fact: string, field: string): string {
  const def = fact === 'spec' || fact === 'process' ? findField(fact as FieldSection, field) : undefined
  if (def?.kind === 'quantity') return formatQuantity(value, def.units)
  return fact === 'metrics' ? formatMetric(field, value) : String(value)
}

function valueWords(value: unknown, fact = '', field = ''): string {
  if (typeof value === 'number') return numberWords(value, fact, field)
  if (Array.isArray(value)) return value.map(v => valueWords(v, fact, field)).join(', ')
  if (value && typeof value === 'object' && 'fact' in value && 'path' in value) {
    const ref = value as { fact: string, path: string }
    return `the ${factWords(ref.fact, ref.path).toLowerCase()}`
  }
  if (value === true) return 'yes'
  if (value === false) return 'no'
  if (value === null) return 'nothing'
  return String(value)
}

/** One condition (or a group) in words; groups nest with "all of (…)", "any of (…)", "not (…)". */
export function conditionWords(c: Condition): string {
  if ('all' in c) return c.all.length === 1 ? conditionWords(c.all[0]!) : `all of (${c.all.map(conditionWords).join('; ')})`
  if ('any' in c) return c.any.length === 1 ? conditionWords(c.any[0]!) : `any of (${c.any.map(conditionWords).join('; ')})`
  if ('not' in c) return `not (${conditionWords(c.not)})`
  return `${factWords(c.fact, c.path)} ${OPERATOR_WORDS[c.operator] ?? c.operator} ${valueWords(c.value, c.fact, fieldOf(c.path))}`
}
