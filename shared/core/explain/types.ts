/**
 * Types of explain mode: a formula (one mathjs expression, named inputs with SI units, the
 * handbook reference) or a procedure (an exact numerical method named, not written out), and
 * the record of one use of either for one candidate (inputs, result) that the engine keeps.
 */

/** Where a formula or procedure comes from, in the handbook's own four labels. */
export type ReferenceLabel = 'published' | 'derived' | 'common-practice' | 'memory'

/** Handbook reference: MODELS.md section(s) and the label of the source. */
export interface HandbookReference {
  section: string
  label: ReferenceLabel
  note?: string
}

/** A named quantity: display symbol (Unicode), SI unit ('' = dimensionless) and plain words. */
export interface QuantitySpec {
  symbol: string
  unit: string
  description: string
}

/** A fixed constant of a formula (its value is part of the definition, not of an input). */
export interface ConstantSpec extends QuantitySpec {
  value: number
}

/** Definition of one formula. Input and constant names are the mathjs symbols of `expression`. */
export interface FormulaSpec {
  id: string
  title: string
  description: string
  expression: string
  inputs: Record<string, QuantitySpec>
  constants?: Record<string, ConstantSpec>
  output: QuantitySpec & { name: string }
  reference: HandbookReference
}

/** Definition of a procedure: an exact numerical method or a rule that picks one of several values. */
export interface ProcedureSpec {
  id: string
  title: string
  description: string
  reference: HandbookReference
}

/** Monte Carlo facts behind a sampled yield. */
export interface MonteCarloFacts {
  trials: number
  passes: number
  seed: number
  confidence: number
  low: number
  high: number
}

/** One use of a formula: the input values it was evaluated with and its result. */
export interface FormulaUse {
  kind: 'formula'
  formula: string
  inputs: Record<string, number>
  result: number
  /** input name → key of the explanation that produced that input (a step before this one) */
  from?: Record<string, string>
}

/** One use of a procedure: what it was given and what it returned. */
export interface ProcedureUse {
  kind: 'procedure'
  procedure: string
  inputs: Record<string, number | string | boolean | null>
  result: number | string | boolean | null
  monteCarlo?: MonteCarloFacts
}

/** How one metric (or an intermediate step) of one candidate was computed. */
export type MetricUse = FormulaUse | ProcedureUse

/** Explanations of one candidate, keyed by metric name (and by the names of intermediate steps). */
export type Trace = Record<string, MetricUse>
