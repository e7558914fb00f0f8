/**
 * The mathjs instance of explain mode: only the parser, the compiler and the functions our
 * formulas use (so the bundle stays small), `predictable` so √ of a negative number is NaN rather
 * than complex, and the distribution functions of the engine under short names:
 * Phi (standard normal CDF), Phiinv (its inverse), C2 (two-sided factor Φ⁻¹((1+Y)/2)),
 * K (Kolmogorov CDF), Kinv (its inverse). max/min are plain Math.max/Math.min (exact selection).
 */
import {
  absDependencies, addDependencies, andDependencies, compileDependencies, create, divideDependencies, expDependencies,
  largerDependencies, logDependencies, multiplyDependencies, parseDependencies, piDependencies, powDependencies,
  sqrtDependencies, subtractDependencies, unaryMinusDependencies, atanDependencies
} from 'mathjs'
import type { EvalFunction, FactoryFunctionMap, MathNode, SymbolNode } from 'mathjs'
import { kolmogorovCdf, kolmogorovQuantile } from '../stats/kolmogorov'
import { normalCdf, normalQuantile, twoSidedFactor } from '../stats/normal'

const DEPENDENCIES: (FactoryFunctionMap | undefined)[] = [
  absDependencies, addDependencies, andDependencies, compileDependencies, divideDependencies, expDependencies,
  largerDependencies, logDependencies, multiplyDependencies, parseDependencies, piDependencies, powDependencies,
  sqrtDependencies, subtractDependencies, unaryMinusDependencies, atanDependencies
]

const factories = DEPENDENCIES.reduce<FactoryFunctionMap>((all, d) => {
  if (!d) {
    throw new Error('explain: a mathjs dependency is missing')
  }
  return { ...all, ...d }
}, {})

const math = create(factories, { predictable: true })

/** The symbol name of a node that is a symbol (not a function name), else null. */
function symbolName(n: MathNode, path: string): string | null {
  return n.type === 'SymbolNode' && path !== 'fn' ? (n as SymbolNode).name : null
}

math.import({
  max: (a: number, b: number) => Math.max(a, b),
  min: (a: number, b: number) => Math.min(a, b),
  Phi: (x: number) => normalCdf(x),
  Phiinv: (p: number) => normalQuantile(p),
  C2: (y: number) => twoSidedFactor(y),
  K: (x: number) => kolmogorovCdf(x),
  Kinv: (y: number) => kolmogorovQuantile(y)
}, { override: true })

/** Function names the formulas may call (everything else in an expression is an input or constant). */
export const FUNCTION_NAMES = new Set(['abs', 'sqrt', 'exp', 'log', 'atan', 'max', 'min', 'Phi', 'Phiinv', 'C2', 'K', 'Kinv'])

/** Parses an expression (throws on a syntax error). */
export function parseExpression(expression: string): MathNode {
  return math.parse(expression)
}

/** Compiles an expression once; the result is evaluated for every computation. */
export function compileExpression(expression: string): EvalFunction {
  return math.compile(expression)
}

/** Symbol names of an expression that are not function names (its inputs and constants). */
export function symbolsOf(node: MathNode): Set<string> {
  const names = new Set<string>()
  node.traverse((n, path) => {
    const name = symbolName(n, path)
    if (name !== null && name !== 'pi') {
      names.add(name)
    }
  })
  return names
}

/** A copy of `node` with each symbol in `values` replaced by a constant-like text node. */
export function substitute(node: MathNode, values: Record<string, string>): MathNode {
  return node.transform((n, path) => {
    const name = symbolName(n, path)
    return name !== null && values[name] !== undefined ? new math.SymbolNode(values[name]) : n
  })
}
