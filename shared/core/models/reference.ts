/**
 * Reference loading (MODELS.md §2, §6). From the exact nominal I_REF(k) of every code:
 * R_in(k) = V_REF / I_REF(k), its extremes, whether it depends on the code, and the largest
 * reference source resistance R_s the INL budget allows. With R_s the DAC sees
 * V_int(k) = V_REF / (1 + R_s·I_REF(k)/V_REF) (the network is linear and every source leg ends
 * on V_int), so the output is the ideal level scaled by that factor, exactly; a code-independent
 * load only changes the gain.
 */
import { OUTPUT_FORMULAS as F } from '../explain/registry'
import type { Trace } from '../explain/types'
import type { InlDefinition } from '../stats/linearity'
import { inlAbsLsb, linearityFromLevels, newLinearityResult } from '../stats/linearity'

/** Relative spread below which the reference load counts as code independent. */
const CODE_DEPENDENT_SPREAD = 1e-9

/** Summary of the reference load of one candidate (SI units; null where not applicable). */
export interface ReferenceSummary {
  irefMinA: number
  irefMaxA: number
  irefMeanA: number
  rinMinOhm: number | null
  rinMaxOhm: number | null
  refLoadCodeDependent: boolean
  refSourceMaxOhm: number | null
  refInlAtSourceLsb: number
  bufferNeeded: boolean
  refPowerMaxW: number
  refPowerMeanW: number
}

/** |INL|max (LSB) caused by a source resistance rsOhm alone (ideal levels k/n scaled by V_int/V_REF). */
export function sourceInducedInlLsb(irefA: Float64Array, vrefV: number, rsOhm: number, def: InlDefinition, levels: Float64Array): number {
  const n = irefA.length
  for (let k = 0; k < n; k++) {
    levels[k] = (k / n) / (1 + (rsOhm * irefA[k]!) / vrefV)
  }
  return inlAbsLsb(linearityFromLevels(levels, def, newLinearityResult()))
}

/** max(0, largest entry) (a loop: a reduce with a callback per code cost more than the rest of the pass). */
function largest(a: ArrayLike<number>): number {
  let m = 0
  for (let k = 0; k < a.length; k++) {
    m = Math.max(m, a[k]!)
  }
  return m
}

/**
 * Largest R_s (ohms) whose INL alone stays within `budgetLsb`: a first-order estimate from a small
 * probe, then secant steps on the exact curve (INL grows about linearly with R_s).
 */
export function allowedSourceOhm(irefA: Float64Array, vrefV: number, budgetLsb: number, def: InlDefinition): number {
  const levels = new Float64Array(irefA.length)
  const rinMin = vrefV / largest(irefA)
  const probe = rinMin * 1e-6
  const f = (rs: number) => sourceInducedInlLsb(irefA, vrefV, rs, def, levels) - budgetLsb
  let r0 = probe
  let f0 = f(r0)
  let r1 = (budgetLsb / (f0 + budgetLsb)) * probe
  for (let i = 0; i < 6; i++) {
    const f1 = f(r1)
    if (Math.abs(f1) <= 1e-4 * budgetLsb || f1 === f0) {
      break
    }
    const next = r1 - (f1 * (r1 - r0)) / (f1 - f0)
    r0 = r1
    f0 = f1
    r1 = next > 0 ? next : r1 / 2
  }
  return r1
}

/** Extremes and sum of the per-code reference current (A). */
function currentRange(irefA: Float64Array): { min: number, max: number, sum: number } {
  let min = Infinity
  let max = 0
  let sum = 0
  for (let k = 0; k < irefA.length; k++) {
    const i = irefA[k]!
    min = Math.min(min, i)
    max = Math.max(max, i)
    sum += i
  }
  return { min, max, sum }
}

function traceProcedures(trace: Trace, r: ReferenceSummary, inputs: { vrefV: number, refSourceOhm: number, budgetLsb: number, def: InlDefinition }): void {
  const { vrefV, refSourceOhm, budgetLsb, def } = inputs
  trace.irefMinA = { kind: 'procedure', procedure: 'nodal-solve-extreme', inputs: { vrefV, extreme: 'min' }, result: r.irefMinA }
  trace.irefMaxA = { kind: 'procedure', procedure: 'nodal-solve-extreme', inputs: { vrefV, extreme: 'max' }, result: r.irefMaxA }
  trace.refLoadCodeDependent = { kind: 'procedure', procedure: 'choice', inputs: { irefMinA: r.irefMinA, irefMaxA: r.irefMaxA, relativeSpread: CODE_DEPENDENT_SPREAD }, result: r.refLoadCodeDependent }
  trace.refSourceMaxOhm = r.refSourceMaxOhm === null
    ? { kind: 'procedure', procedure: 'not-applicable', inputs: { refLoadCodeDependent: r.refLoadCodeDependent }, result: null }
    : { kind: 'procedure', procedure: 'source-inl', inputs: { vrefV, budgetLsb, inlDefinition: def }, result: r.refSourceMaxOhm }
  trace.refInlAtSourceLsb = { kind: 'procedure', procedure: 'source-inl', inputs: { vrefV, refSourceOhm, inlDefinition: def }, result: r.refInlAtSourceLsb }
  trace.bufferNeeded = { kind: 'procedure', procedure: 'choice', inputs: { refLoadCodeDependent: r.refLoadCodeDependent, refSourceOhm, refSourceMaxOhm: r.refSourceMaxOhm }, result: r.bufferNeeded }
  if (r.rinMinOhm === null) {
    trace.rinMinOhm = { kind: 'procedure', procedure: 'not-applicable', inputs: { irefMaxA: r.irefMaxA }, result: null }
  }
  if (r.rinMaxOhm === null) {
    trace.rinMaxOhm = { kind: 'procedure', procedure: 'not-applicable', inputs: { irefMinA: r.irefMinA }, result: null }
  }
}

/**
 * Reference summary from the exact per-code I_REF (A).
 * @param refSourceOhm actual source resistance (0 = buffered reference)
 * @param budgetLsb INL share allowed for the reference source
 */
export function referenceSummary(irefA: Float64Array, vrefV: number, refSourceOhm: number, budgetLsb: number, def: InlDefinition, trace?: Trace): ReferenceSummary {
  const { min, max, sum } = currentRange(irefA)
  const codeDependent = max - min > CODE_DEPENDENT_SPREAD * max
  const refSourceMaxOhm = codeDependent && max > 0 ? allowedSourceOhm(irefA, vrefV, budgetLsb, def) : null
  const refInlAtSourceLsb = codeDependent && refSourceOhm > 0
    ? sourceInducedInlLsb(irefA, vrefV, refSourceOhm, def, new Float64Array(irefA.length))
    : 0
  const from = { I_max: 'irefMaxA' }
  const r: ReferenceSummary = {
    irefMinA: min,
    irefMaxA: max,
    irefMeanA: sum / irefA.length,
    rinMinOhm: max > 0 ? F.rinMin.use({ V_REF: vrefV, I_max: max }, trace, 'rinMinOhm', from) : null,
    rinMaxOhm: min > 0 ? F.rinMax.use({ V_REF: vrefV, I_min: min }, trace, 'rinMaxOhm', { I_min: 'irefMinA' }) : null,
    refLoadCodeDependent: codeDependent,
    refSourceMaxOhm,
    refInlAtSourceLsb,
    // a code-dependent load needs a low-impedance (buffered) reference unless the given source is small enough
    bufferNeeded: codeDependent && (refSourceOhm === 0 || refSourceMaxOhm === null || refSourceOhm > refSourceMaxOhm),
    refPowerMaxW: F.powerMax.use({ V_REF: vrefV, I_max: max }, trace, 'refPowerMaxW', from),
    refPowerMeanW: F.powerMean.use({ V_REF: vrefV, I_sum: sum, n_codes: irefA.length }, trace, 'refPowerMeanW')
  }
  if (trace) {
    traceProcedures(trace, r, { vrefV, refSourceOhm, budgetLsb, def })
  }
  return r
}
