/**
 * `explainMetric`: one recorded use turned into what the "How was this computed" view shows —
 * the expression and a readable rendering, the inputs with units and values, the expression with
 * the numbers substituted, the result and the handbook reference.
 */
import type { MathNode } from 'mathjs'
import { substitute } from './math'
import { formulaById, procedureSpec } from './registry'
import type { FormulaSpec, HandbookReference, MetricUse, MonteCarloFacts, QuantitySpec } from './types'

/** One input row of an explanation. */
export interface ExplainedInput extends QuantitySpec {
  name: string
  value: number | string | boolean | null
  /** key of the explanation that produced this input */
  from?: string
  constant?: boolean
}

/** Everything the explain view shows for one metric of one candidate. */
export interface MetricExplanation {
  key: string
  kind: 'formula' | 'procedure'
  id: string
  title: string
  description: string
  expression: string | null
  readable: string | null
  substituted: string | null
  inputs: ExplainedInput[]
  output: (QuantitySpec & { name: string }) | null
  result: number | string | boolean | null
  reference: HandbookReference
  monteCarlo?: MonteCarloFacts
}

/** Formats a value with its unit for the substituted expression. */
export type ValueFormatter = (value: number, unit: string) => string

const plain: ValueFormatter = (v, unit) => `${Number(v.toPrecision(4))}${unit ? ` ${unit}` : ''}`

const TIDY: [RegExp, string][] = [
  [/ \* /g, ' · '], [/\bsqrt\(/g, '√('], [/\blog\(/g, 'ln('], [/\bPhiinv\(/g, 'Φ⁻¹('], [/\bPhi\(/g, 'Φ('],
  [/\bKinv\(/g, 'K⁻¹('], [/\bC2\(/g, 'C('], [/\babs\(([^()]*)\)/g, '|$1|'], [/ - /g, ' − '], [/\bpi\b/g, 'π']
]

/**
 * The floor that keeps a logarithm finite in the computation (`exp(n·ln(max(x, 1e-300)))`) is not
 * part of the formula a person reads: shown as the power it computes, (x)^n. Display only.
 */
const CLAMPED_POWER = /\bexp\(([^()]+?) · ln\(max\((.+), 1e-300\)\)\)/

/** A mathjs rendering made readable: ·, √, ln, Φ, Φ⁻¹, K⁻¹, |x|, −, π, and no 1e-300 floor. */
export function tidy(text: string): string {
  return TIDY.reduce((t, [re, to]) => t.replace(re, to), text).replace(CLAMPED_POWER, '($2)^$1')
}

function render(node: MathNode, names: Record<string, string>): string {
  return tidy(substitute(node, names).toString({ parenthesis: 'keep' }))
}

/** The readable rendering of a formula: display symbols in place of the input names. */
export function readableFormula(spec: FormulaSpec, node: MathNode): string {
  const symbols = Object.fromEntries([...Object.entries(spec.inputs), ...Object.entries(spec.constants ?? {})].map(([k, q]) => [k, q.symbol]))
  return `${spec.output.symbol} = ${render(node, symbols)}`
}

function explainFormula(key: string, use: Extract<MetricUse, { kind: 'formula' }>, format: ValueFormatter): MetricExplanation {
  const f = formulaById(use.formula)
  if (!f) {
    throw new Error(`explainMetric: unknown formula ${use.formula}`)
  }
  const { spec } = f
  const inputs: ExplainedInput[] = Object.entries(spec.inputs).map(([name, q]) => ({ name, ...q, value: use.inputs[name] ?? null, ...(use.from?.[name] ? { from: use.from[name] } : {}) }))
  const constants: ExplainedInput[] = Object.entries(spec.constants ?? {}).map(([name, c]) => ({ name, symbol: c.symbol, unit: c.unit, description: c.description, value: c.value, constant: true }))
  const values = Object.fromEntries([...inputs, ...constants].map(i => [i.name, typeof i.value === 'number' ? format(i.value, i.unit) : '?']))
  return {
    key, kind: 'formula', id: spec.id, title: spec.title, description: spec.description,
    expression: spec.expression, readable: readableFormula(spec, f.node),
    substituted: `${render(f.node, values)} = ${format(use.result, spec.output.unit)}`,
    inputs: [...inputs, ...constants], output: spec.output, result: use.result, reference: spec.reference
  }
}

/**
 * The explanation of one recorded use (a metric or an intermediate step of one candidate).
 * @param format how numbers are written in the substituted expression (default: 4 significant figures)
 */
export function explainMetric(key: string, use: MetricUse, format: ValueFormatter = plain): MetricExplanation {
  if (use.kind === 'formula') {
    return explainFormula(key, use, format)
  }
  const p = procedureSpec(use.procedure)
  if (!p) {
    throw new Error(`explainMetric: unknown procedure ${use.procedure}`)
  }
  const inputs: ExplainedInput[] = Object.entries(use.inputs).map(([name, value]) => ({ name, symbol: name, unit: '', description: '', value }))
  return {
    key, kind: 'procedure', id: p.id, title: p.title, description: p.description, expression: null, readable: null, substituted: null,
    inputs, output: null, result: use.result, reference: p.reference, ...(use.monteCarlo ? { monteCarlo: use.monteCarlo } : {})
  }
}
