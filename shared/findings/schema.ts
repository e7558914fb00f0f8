/**
 * The rule-pack format (zod). A pack is data run by json-rules-engine: conditions over the facts
 * spec, process, candidate, metrics and derived (fields.ts), and messages with placeholders.
 */
import { z } from 'zod'
import { isKnownField } from './fields'
import { templateProblem } from './template'

export const SEVERITIES = ['fail', 'warn', 'advice', 'note'] as const
export type Severity = typeof SEVERITIES[number]
export const OPERATORS = ['equal', 'notEqual', 'lessThan', 'lessThanInclusive', 'greaterThan', 'greaterThanInclusive', 'in', 'notIn'] as const
/** Where a rule's threshold comes from (handbook source tags). */
export const THRESHOLD_SOURCES = ['spec', 'derived', 'published', 'common-practice', 'memory'] as const

const KEBAB = /^[a-z][a-z0-9]*(-[a-z0-9]+)*$/
const PATH = /^\$\.([a-zA-Z][a-zA-Z0-9]*)$/
const kebab = (what: string) => z.string({ error: `must be a kebab-case ${what}` }).max(64, `must be at most 64 characters`).regex(KEBAB, `must be a kebab-case ${what} (lower-case words joined by -)`)
const text = (max: number) => z.string({ error: `must be text of 1 to ${max} characters` }).trim().min(1, `must be text of 1 to ${max} characters`).max(max, `must be text of 1 to ${max} characters`)
const template = (max: number) => text(max).superRefine((s, ctx) => {
  const problem = templateProblem(s)
  if (problem) ctx.addIssue({ code: 'custom', message: problem })
})

const factRef = z.strictObject({ fact: z.enum(['spec', 'process', 'candidate', 'metrics', 'derived'], { error: 'must be one of spec, process, candidate, metrics, derived' }), path: z.string() })
  .superRefine((v, ctx) => checkPath(v.fact, v.path, ctx))

function checkPath(fact: string, path: string, ctx: z.RefinementCtx) {
  const field = PATH.exec(path)?.[1]
  if (!field) ctx.addIssue({ code: 'custom', path: ['path'], message: 'must be $.<field>, e.g. $.totalAreaMm2' })
  else if (!isKnownField(fact, field)) ctx.addIssue({ code: 'custom', path: ['path'], message: `names an unknown field of ${fact}: ${field}` })
}

const scalar = z.union([z.number(), z.string().max(200), z.boolean(), z.null()])
const value = z.union([scalar, z.array(scalar).max(50), factRef], { error: 'must be a number, text, true/false, null, a list of those, or { fact, path }' })

const leaf = z.strictObject({
  fact: z.enum(['spec', 'process', 'candidate', 'metrics', 'derived'], { error: 'must be one of spec, process, candidate, metrics, derived' }),
  path: z.string({ error: 'must be $.<field>, e.g. $.totalAreaMm2' }),
  operator: z.enum(OPERATORS, { error: `must be one of ${OPERATORS.join(', ')}` }),
  value
}).superRefine((v, ctx) => {
  checkPath(v.fact, v.path, ctx)
  if ((v.operator === 'in' || v.operator === 'notIn') && !Array.isArray(v.value)) {
    ctx.addIssue({ code: 'custom', path: ['value'], message: `must be a list for operator ${v.operator}` })
  }
})

export type Condition = z.infer<typeof leaf> | { all: Condition[] } | { any: Condition[] } | { not: Condition }

const nested: z.ZodType<Condition> = z.lazy(() => z.union([
  leaf,
  z.strictObject({ all: z.array(nested).min(1).max(20) }),
  z.strictObject({ any: z.array(nested).min(1).max(20) }),
  z.strictObject({ not: nested })
], { error: 'must be a condition { fact, path, operator, value } or { all | any: [...] } or { not: ... }' }))

const topLevel = z.union([
  z.strictObject({ all: z.array(nested).min(1, 'must list at least one condition').max(20) }),
  z.strictObject({ any: z.array(nested).min(1, 'must list at least one condition').max(20) })
], { error: 'must be { all: [...] } or { any: [...] }' })

/** Deepest nesting of all / any / not a rule may use (the top-level all or any is level 1). */
export const MAX_CONDITION_DEPTH = 8

/**
 * The nesting depth of a conditions tree, measured without recursion (before the recursive schema
 * runs: thousands of `not` levels overflowed the stack, and 28 passed the database's JSON depth).
 */
function conditionDepth(value: unknown): number {
  let deepest = 0
  const stack: [unknown, number][] = [[value, 1]]
  while (stack.length) {
    const [node, depth] = stack.pop()!
    if (!node || typeof node !== 'object') continue
    deepest = Math.max(deepest, depth)
    if (deepest > MAX_CONDITION_DEPTH) return deepest
    const o = node as Record<string, unknown>
    for (const list of [o.all, o.any]) if (Array.isArray(list)) list.forEach(c => stack.push([c, depth + 1]))
    if ('not' in o) stack.push([o.not, depth + 1])
  }
  return deepest
}

const boundedConditions = z.unknown().superRefine((v, ctx) => {
  if (conditionDepth(v) > MAX_CONDITION_DEPTH) ctx.addIssue({ code: 'custom', message: `must nest all, any and not at most ${MAX_CONDITION_DEPTH} levels deep` })
}).pipe(topLevel)

export const ruleSchema = z.strictObject({
  id: kebab('rule id'),
  severity: z.enum(SEVERITIES, { error: 'must be one of fail, warn, advice, note' }),
  title: text(120),
  explanation: template(800),
  action: template(500),
  basis: z.strictObject({
    handbook: z.array(z.string().regex(/^§\d+(\.\d+)*$/, 'must be handbook sections like §4.3'), { error: 'must be a list of handbook sections like ["§4.3"]' }).min(1, 'must name at least one handbook section').max(6),
    metrics: z.array(z.string(), { error: 'must list the metrics the rule rests on' }).min(1, 'must name at least one metric').max(12)
      .superRefine((list, ctx) => list.forEach((m, i) => {
        const [fact, field] = m.includes('.') ? m.split('.', 2) : ['metrics', m]
        if (!isKnownField(fact!, field!)) ctx.addIssue({ code: 'custom', path: [i], message: `names an unknown metric: ${m}` })
      }))
  }),
  threshold: z.strictObject({
    source: z.enum(THRESHOLD_SOURCES, { error: `must be one of ${THRESHOLD_SOURCES.join(', ')}` }),
    note: text(300)
  }),
  conditions: boundedConditions
})

export const rulePackDocumentSchema = z.strictObject({
  id: kebab('pack id'),
  name: text(120),
  description: z.string().trim().max(1000, 'must be at most 1000 characters').default(''),
  version: z.number().int().min(1).optional(),
  rules: z.array(ruleSchema, { error: 'must be a list of rules' }).min(1, 'must hold at least one rule').max(100, 'must hold at most 100 rules')
}).superRefine((pack, ctx) => {
  const seen = new Set<string>()
  pack.rules.forEach((r, i) => {
    if (seen.has(r.id)) ctx.addIssue({ code: 'custom', path: ['rules', i, 'id'], message: `repeats rule id ${r.id}; rule ids must be unique in a pack` })
    seen.add(r.id)
  })
})

export type RuleDefinition = z.infer<typeof ruleSchema>
export type RulePackDocument = z.infer<typeof rulePackDocumentSchema>
/** A pack ready to run: its document plus the version that produced the findings. */
export type RulePack = RulePackDocument & { version: number, source: 'built-in' | 'team' }
