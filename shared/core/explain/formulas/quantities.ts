/**
 * Shared input declarations of the formula definitions (symbol, SI unit, plain words), so one
 * quantity reads the same in every explanation.
 */
import type { QuantitySpec } from '../types'

/** A quantity declaration. */
export function q(symbol: string, unit: string, description: string): QuantitySpec {
  return { symbol, unit, description }
}

export const Q = {
  N: q('N', '', 'resolution in bits'),
  M: q('M', '', 'unary (or coarse) bits'),
  L: q('L', '', 'binary (or fine) bits, N − M'),
  u: q('u', '', 'unit resistors per 2R element (2 = two units in series, 1 = one element)'),
  sigmaU: q('σ_u', '', 'relative σ of one unit resistor about the array mean'),
  a: q('a', '', 'scale: the statistic in units of σ_u'),
  n: q('n', '', 'nearly independent steps (or random-walk steps) the statistic is taken over'),
  Y: q('Y', '', 'required yield (fraction)'),
  inlT: q('T_INL', 'LSB', 'INL target'),
  dnlT: q('T_DNL', 'LSB', 'DNL target'),
  vref: q('V_REF', 'V', 'reference voltage (= full scale)'),
  temp: q('T', 'K', 'temperature'),
  c: q('C_L', 'F', 'load capacitance'),
  rout: q('R_out', 'Ω', 'output resistance'),
  unitOhm: q('R_unit', 'Ω', 'unit resistance'),
  sheet: q('R_□', 'Ω', 'sheet resistance of the resistor layer'),
  aSingle: q('A_R,single', 'µm', 'matching coefficient of one element about the array mean (fraction·µm)')
}
