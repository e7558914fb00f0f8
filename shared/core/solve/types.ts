/**
 * Internal result of an exact solve: one typed array per quantity, indexed by code.
 * `routOhm` holds Infinity where the output is open (current mode at code 0); the contract
 * layer turns that into `null`.
 */
export interface CircuitSolution {
  /** 'voltage': `value` is V_out in volts; 'current': `value` is I_OUT in amperes */
  output: 'voltage' | 'current'
  value: Float64Array
  /** current drawn from V_REF (A) */
  irefA: Float64Array
  /** Thevenin resistance at the output (ohms), Infinity where open */
  routOhm: Float64Array
}
