/**
 * Quantities that come from an exact numerical procedure or from a rule that picks a value: the
 * explanation names the procedure, its inputs and the handbook section instead of a formula.
 */
import type { ProcedureSpec } from './types'

const p = (id: string, title: string, description: string, section: string, label: ProcedureSpec['reference']['label']): ProcedureSpec => ({ id, title, description, reference: { section, label } })

export const PROCEDURES: Record<string, ProcedureSpec> = {
  'nodal-solve-extreme': p('nodal-solve-extreme', 'Exact nodal solve, extreme over codes', 'The nominal circuit is solved exactly for every code (nodal analysis of the resistor network, switches as resistors); the value is the smallest or largest over all codes.', '§2', 'derived'),
  'nodal-linearity': p('nodal-linearity', 'Exact nodal solve, systematic linearity', 'Every code level of the nominal circuit from the exact nodal solve, then INL/DNL against the chosen line (endpoint or best-fit); the worst code is reported.', '§1, §2', 'derived'),
  'source-inl': p('source-inl', 'Reference source resistance, exact per-code INL', 'Each code level is scaled by V_int/V_REF = 1/(1 + R_s·I_REF(k)/V_REF) from the exact I_REF(k); the allowed R_s is found by secant steps on that exact INL curve.', '§6', 'derived'),
  'per-code-max': p('per-code-max', 'Largest over codes', 'The formula is evaluated for every code (or every one-code transition) and the largest value is reported; the explanation shows the worst one.', '§5, §6', 'common-practice'),
  'monte-carlo-yield': p('monte-carlo-yield', 'Monte Carlo yield', 'Sample circuits are drawn with seeded random unit errors of σ_u; the yield is the fraction of trials that pass, with a Wilson confidence interval.', '§4.3', 'derived'),
  'analytic-yield': p('analytic-yield', 'Analytic yield', 'No Monte Carlo was run; the analytic yield is reported.', '§4.3', 'derived'),
  'given': p('given', 'Given in the input', 'The value was given in the process or spec; nothing was computed.', '§4.1', 'common-practice'),
  'topology-constant': p('topology-constant', 'Fixed by the topology', 'The count does not depend on the resolution for this topology.', '§3', 'derived'),
  'choice': p('choice', 'Rule that picks a value', 'A rule compared computed values and picked one; the inputs show what it compared.', '§4.6, §6', 'common-practice'),
  'sampled-sizing': p('sampled-sizing', 'Sizing on a fixed sample of circuits', 'A fixed, seeded sample of circuits (its size is the "trials" input) is solved exactly with every deterministic error the engine models (switch on-resistance at its worst corner, loading) and random unit errors; each circuit’s error grows with σ_u, which gives the σ_u at which it stops passing. The largest σ_u at which the sample meets the yield target with a 99 % one-sided margin is taken; beyond the sample’s resolution a Gaussian tail fitted to its failing circuits extends it.', '§4.9', 'derived'),
  'sampled-yield': p('sampled-yield', 'Fast yield on the sizing sample', 'The fraction of the sizing sample that passes at the drawn σ_u (INL, DNL or monotonicity), with every deterministic error of the circuit included; where too few circuits fail, the fitted tail gives it.', '§4.9', 'derived'),
  'bridge-sample-yield': p('bridge-sample-yield', 'INL yield from a scaled reference bridge', 'The unary array is too large to sample in the time of a live preview. Its INL is a Brownian bridge whose shape does not depend on the array length: the fixed sample of an 11-bit string with the same INL definition gives the law of the normalised worst INL, scaled by this array\'s own factor (fitted tail beyond the sample).', '§4.9', 'derived'),
  'closed-form-yield': p('closed-form-yield', 'Closed-form yield (estimate)', 'The array is too large to size on a sample in the time of a live preview; the yield is the closed form of §4.3 with the targets reduced by the nominal error, an estimate to be confirmed by Monte Carlo.', '§4.3, §4.9', 'derived'),
  'switch-design': p('switch-design', 'Switch design chosen for the candidate', 'Every switch handling (none, absorbed into the leg, matched dummy, scaled widths) and width is solved exactly at both ends of the switch spread; the design with the least switch area whose nominal INL and DNL stay within a tenth of the targets is chosen.', '§11', 'common-practice'),
  'not-applicable': p('not-applicable', 'Does not apply', 'The quantity does not apply to this candidate or input, so it is null.', '§1', 'common-practice')
}
