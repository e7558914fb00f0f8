/**
 * Explain-mode entries of the glitch metrics: the worst and the major-carry transitions are
 * re-evaluated through the registry formulas (skew, charge, total) with that transition's
 * activity and R_out, which reproduces the per-transition table exactly (models/glitch.ts).
 */
import type { GlitchSummary } from '../evaluation/glitch-summary'
import type { GlitchProcess } from '../models/glitch'
import { chargeImpulseVs, skewImpulseVs, transitionActivity } from '../models/glitch'
import type { CandidateShape } from '../models/shapes'
import { GLITCH_FORMULAS as F } from './registry'
import type { Trace } from './types'

function traceTransition(s: CandidateShape, k: number, vLsbV: number, routOhm: ArrayLike<number>, p: GlitchProcess, trace: Trace, key: string): void {
  const a = transitionActivity(s, k, p)
  const skewKey = `${key}Skew`
  const chargeKey = `${key}Charge`
  const skew = skewImpulseVs(a, vLsbV, p.switchSkewS, trace, skewKey)
  const r = routOhm[k + 1]!
  const charge = chargeImpulseVs(a, p.switchChargeC, r, trace, chargeKey)
  if (!Number.isFinite(r)) {
    trace[chargeKey] = { kind: 'procedure', procedure: 'not-applicable', inputs: { routOhm: null }, result: 0 }
  }
  F.total.use({ GI_skew: skew, GI_q: charge }, trace, key, { GI_skew: skewKey, GI_q: chargeKey })
}

/** Records the glitch metrics of one candidate: worst transition, its codes, and the major carry. */
export function traceGlitch(s: CandidateShape, vLsbV: number, routOhm: ArrayLike<number>, p: GlitchProcess, g: GlitchSummary, trace: Trace): void {
  traceTransition(s, g.glitchWorstFromCode, vLsbV, routOhm, p, trace, 'glitchWorstVs')
  traceTransition(s, 2 ** (s.bits - 1) - 1, vLsbV, routOhm, p, trace, 'glitchMajorCarryVs')
  const inputs = { transitions: 2 ** s.bits - 1, glitchWorstVs: g.glitchWorstVs }
  trace.glitchWorstFromCode = { kind: 'procedure', procedure: 'per-code-max', inputs, result: g.glitchWorstFromCode }
  trace.glitchWorstToCode = { kind: 'procedure', procedure: 'per-code-max', inputs, result: g.glitchWorstToCode }
}
