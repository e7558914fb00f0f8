import { REQUIRED_METRICS, type EvaluateOutput } from '../core/contract/evaluate-output'
import type { InputChange, MetricChange } from '../types/revisions'

type Inputs = Record<'spec' | 'process' | 'options', Record<string, unknown>>

/** JSON with sorted object keys, so equal values compare equal whatever their key order. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) => v && typeof v === 'object' && !Array.isArray(v)
    ? Object.fromEntries(Object.entries(v as Record<string, unknown>).sort(([a], [b]) => a.localeCompare(b)))
    : v)
}

/** Every input field whose value differs between two revisions, section by section. */
export function diffInputs(from: Inputs, to: Inputs): InputChange[] {
  const changes: InputChange[] = []
  for (const section of ['spec', 'process', 'options'] as const) {
    const keys = new Set([...Object.keys(from[section] ?? {}), ...Object.keys(to[section] ?? {})])
    for (const field of keys) {
      const a = from[section]?.[field]
      const b = to[section]?.[field]
      if (canonicalJson(a) !== canonicalJson(b)) changes.push({ section, field, from: a ?? null, to: b ?? null })
    }
  }
  return changes
}

/** Per candidate (matched by id), every fixed metric whose value differs; candidates found in one side only. */
export function diffResults(from: EvaluateOutput, to: EvaluateOutput): { changed: MetricChange[], onlyIn: { from: string[], to: string[] } } {
  const before = new Map(from.candidates.map(c => [c.id, c]))
  const after = new Map(to.candidates.map(c => [c.id, c]))
  const changed: MetricChange[] = []
  for (const [id, b] of after) {
    const a = before.get(id)
    if (!a) continue
    for (const metric of REQUIRED_METRICS) {
      const x = a.metrics[metric] ?? null
      const y = b.metrics[metric] ?? null
      if (x !== y) changed.push({ candidate: id, metric, from: x, to: y })
    }
  }
  return {
    changed,
    onlyIn: { from: [...before.keys()].filter(k => !after.has(k)), to: [...after.keys()].filter(k => !before.has(k)) }
  }
}
