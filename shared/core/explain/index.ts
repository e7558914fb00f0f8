/**
 * Explain mode of the engine: the formula registry the models compute through, procedures for
 * what is solved numerically, and the API that turns a candidate into explanations.
 */
export type { Formula } from './define'
export { defineFormula, FormulaError } from './define'
export type { ExplainedInput, MetricExplanation, ValueFormatter } from './explain'
export { explainMetric, readableFormula, tidy } from './explain'
export { explainCandidate, monteCarloOf } from './candidate'
export { allFormulas, formulaById, formulaSpec, procedureSpec } from './registry'
export type * from './types'
