/**
 * `defineFormula`: a formula compiled once (mathjs `compile`) and evaluated for the engine's
 * computation, so the number reported and the number explained come from the same expression.
 * `use` evaluates and, given a trace, records the inputs and the result under a key.
 */
import type { EvalFunction, MathNode } from 'mathjs'
import { compileExpression, parseExpression, symbolsOf } from './math'
import type { FormulaSpec, FormulaUse, Trace } from './types'

/** A compiled formula. */
export interface Formula {
  spec: FormulaSpec
  node: MathNode
  /** Evaluates the compiled expression for the given inputs (every input required). */
  compute: (inputs: Record<string, number>) => number
  /** compute(), recording { formula, inputs, result } in `trace[key]` when a trace is given. */
  use: (inputs: Record<string, number>, trace?: Trace, key?: string, from?: Record<string, string>) => number
}

/** Thrown when a formula definition or a call of it is inconsistent. */
export class FormulaError extends Error {}

function checkSymbols(spec: FormulaSpec, node: MathNode): void {
  const declared = new Set([...Object.keys(spec.inputs), ...Object.keys(spec.constants ?? {})])
  for (const name of symbolsOf(node)) {
    if (!declared.has(name)) {
      throw new FormulaError(`${spec.id}: symbol ${name} is neither an input nor a constant`)
    }
  }
  for (const name of declared) {
    if (!symbolsOf(node).has(name)) {
      throw new FormulaError(`${spec.id}: ${name} is declared but not used`)
    }
  }
}

/** Compiles a formula definition; throws FormulaError when its symbols and declarations disagree. */
export function defineFormula(spec: FormulaSpec): Formula {
  const node = parseExpression(spec.expression)
  checkSymbols(spec, node)
  const compiled: EvalFunction = compileExpression(spec.expression)
  const names = Object.keys(spec.inputs)
  const constants = Object.entries(spec.constants ?? {}).map(([k, c]): [string, number] => [k, c.value])
  const compute = (inputs: Record<string, number>): number => {
    // a Map scope: mathjs uses it as is (a plain object would be wrapped on every call)
    const scope = new Map<string, number>(constants)
    for (const name of names) {
      const v = inputs[name]
      if (typeof v !== 'number') {
        throw new FormulaError(`${spec.id}: input ${name} missing`)
      }
      scope.set(name, v)
    }
    const result: unknown = compiled.evaluate(scope)
    return typeof result === 'number' ? result : Number.NaN
  }
  const use = (inputs: Record<string, number>, trace?: Trace, key?: string, from?: Record<string, string>): number => {
    const result = compute(inputs)
    if (trace && key) {
      const entry: FormulaUse = { kind: 'formula', formula: spec.id, inputs: pick(inputs, names), result }
      trace[key] = from ? { ...entry, from } : entry
    }
    return result
  }
  return { spec, node, compute, use }
}

function pick(inputs: Record<string, number>, names: string[]): Record<string, number> {
  return Object.fromEntries(names.map(n => [n, inputs[n]!]))
}
