/**
 * The formula registry: every formula of the engine by id, compiled once at load. Models compute
 * through these objects (`FORMULAS.tau.use(...)`), and explanations look definitions up by id.
 */
import type { Formula } from './define'
import { COUNT_FORMULAS } from './formulas/counts'
import { GLITCH_FORMULAS } from './formulas/glitch'
import { MATCHING_FORMULAS } from './formulas/matching'
import { OUTPUT_FORMULAS } from './formulas/output'
import { SIZING_FORMULAS } from './formulas/sizing'
import { PROCEDURES } from './procedures'
import type { FormulaSpec, ProcedureSpec } from './types'

export { COUNT_FORMULAS, GLITCH_FORMULAS, MATCHING_FORMULAS, OUTPUT_FORMULAS, SIZING_FORMULAS, PROCEDURES }

const ALL: Formula[] = [COUNT_FORMULAS, GLITCH_FORMULAS, MATCHING_FORMULAS, OUTPUT_FORMULAS, SIZING_FORMULAS].flatMap(group => Object.values(group))

const BY_ID = new Map<string, Formula>()
for (const f of ALL) {
  if (BY_ID.has(f.spec.id)) {
    throw new Error(`formula registry: duplicate id ${f.spec.id}`)
  }
  BY_ID.set(f.spec.id, f)
}

/** Every registered formula. */
export function allFormulas(): Formula[] {
  return [...BY_ID.values()]
}

/** The formula of an id, or undefined. */
export function formulaById(id: string): Formula | undefined {
  return BY_ID.get(id)
}

/** The definition (plain data) of a formula id, or undefined. */
export function formulaSpec(id: string): FormulaSpec | undefined {
  return BY_ID.get(id)?.spec
}

/** The procedure of an id, or undefined. */
export function procedureSpec(id: string): ProcedureSpec | undefined {
  return PROCEDURES[id]
}
