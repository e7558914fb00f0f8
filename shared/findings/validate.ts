/**
 * Validates a rule pack and names the file, the rule and the field of every problem, e.g.
 * `rules/team.json: rule "area-tight" (rules[2]), field conditions.all[0].path: names an unknown field of metrics: areaMm2`.
 */
import type { z } from 'zod'
import { formatPath } from '../core/contract/errors'
import { rulePackDocumentSchema } from './schema'
import type { RulePack, RulePackDocument } from './schema'

export interface PackIssue {
  /** path inside the pack, e.g. `rules[2].conditions.all[0].path` */
  path: string
  /** id of the rule the problem sits in, when it is inside one */
  ruleId: string | null
  /** path inside that rule, e.g. `conditions.all[0].path` */
  field: string
  message: string
  /** the path as keys and indices, for re-raising the issue under another root */
  segments: (string | number)[]
}

export type PackCheck = { ok: true, pack: RulePackDocument } | { ok: false, issues: PackIssue[], message: string }

function ruleIdAt(raw: unknown, index: number): string | null {
  const rules = (raw as { rules?: unknown } | null)?.rules
  const rule = Array.isArray(rules) ? rules[index] as { id?: unknown } | undefined : undefined
  return typeof rule?.id === 'string' ? rule.id : null
}

function toIssue(raw: unknown, issue: z.core.$ZodIssue): PackIssue {
  const p = issue.path.filter((k): k is string | number => typeof k !== 'symbol')
  const segments = [...p]
  if (p[0] === 'rules' && typeof p[1] === 'number') {
    const rest = p.slice(2)
    return { path: formatPath(p), ruleId: ruleIdAt(raw, p[1]), field: rest.length ? formatPath(rest) : '(rule)', message: issue.message, segments }
  }
  return { path: formatPath(p), ruleId: null, field: formatPath(p), message: issue.message, segments }
}

/** One line per issue: where it is (file, rule, field) and what is wrong. */
export function describeIssue(issue: PackIssue, file?: string): string {
  const where = issue.ruleId !== null || issue.path.startsWith('rules[')
    ? `rule "${issue.ruleId ?? '(no id)'}" (${issue.path.slice(0, issue.path.indexOf(']') + 1)}), field ${issue.field}`
    : `field ${issue.field}`
  return `${file ? `${file}: ` : ''}${where}: ${issue.message}`
}

/** A failed union (condition shapes) reports the branch that came closest, with its full path. */
function flatten(issue: z.core.$ZodIssue): z.core.$ZodIssue[] {
  if (issue.code === 'invalid_union' && issue.errors.length > 0) {
    const best = issue.errors.reduce((a, b) => (b.length < a.length ? b : a))
    return best.flatMap(i => flatten({ ...i, path: [...issue.path, ...i.path] } as z.core.$ZodIssue))
  }
  return [issue]
}

/** Checks a pack document (built-in file or a team's JSON). */
export function checkRulePack(raw: unknown, file?: string): PackCheck {
  const result = rulePackDocumentSchema.safeParse(raw)
  if (result.success) return { ok: true, pack: result.data }
  const issues = result.error.issues.flatMap(flatten).map(i => toIssue(raw, i))
  const lines = issues.slice(0, 3).map(i => describeIssue(i, file))
  const more = issues.length > 3 ? ` (and ${issues.length - 3} more)` : ''
  return { ok: false, issues, message: lines.join('; ') + more }
}

/** Thrown when a built-in pack does not load; the message names the file, rule and field. */
export class RulePackError extends Error {
  constructor(message: string, readonly issues: PackIssue[]) {
    super(message)
    this.name = 'RulePackError'
  }
}

/** Loads a pack or throws RulePackError naming the file, the rule and the field. */
export function loadRulePack(raw: unknown, file: string, source: RulePack['source'] = 'built-in'): RulePack {
  const check = checkRulePack(raw, file)
  if (!check.ok) throw new RulePackError(`Rule pack refused: ${check.message}`, check.issues)
  if (source === 'built-in' && check.pack.version === undefined) {
    throw new RulePackError(`Rule pack refused: ${file}: field version: a built-in pack must state its version`, [])
  }
  return { ...check.pack, version: check.pack.version ?? 1, source }
}
