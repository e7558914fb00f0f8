/**
 * First-order glitch model (MODELS.md §5), for ranking. For each one-code transition k → k + 1:
 * - skew term GI_skew = ½ (W_on + W_off) · V_LSB · |Δt| when both groups are non-empty, else 0,
 *   with W the summed ideal weights (LSB) of the elements turning on and off;
 * - charge term GI_q = α · q_net · R_out(k + 1), with q_net = toggled switches × q (no credit for
 *   cancellation between opening and closing switches [CP, conservative]) and α the fraction
 *   reaching the output (tap switches of strings ≈ 1, ladder leg switches small).
 * Binary sections toggle popcount(k ⊕ (k+1)) switches, a thermometer section one leg, a direct
 * string two tap switches (skew-free); a tree string behaves like a binary skew term on the tap index.
 */
import { GLITCH_FORMULAS as F } from '../explain/registry'
import type { Trace } from '../explain/types'
import type { CandidateShape } from './shapes'
import { lowBits } from './shapes'

/** Process inputs of the glitch model. */
export interface GlitchProcess {
  switchSkewS: number
  switchChargeC: number
  tapChargeFraction: number
  legChargeFraction: number
}

/** Switch activity of one transition: weights (LSB) turning on/off, switches toggled, charge fraction. */
export interface Activity {
  wOn: number
  wOff: number
  toggled: number
  alpha: number
}

/** Trailing ones of k: the number of lower bits that turn off when k → k + 1. */
function trailingOnes(k: number, bits: number): number {
  let j = 0
  while (j < bits && ((k >> j) & 1) === 1) {
    j++
  }
  return j
}

function set(a: Activity, wOn: number, wOff: number, toggled: number, alpha: number): Activity {
  a.wOn = wOn
  a.wOff = wOff
  a.toggled = toggled
  a.alpha = alpha
  return a
}

/** Activity of the transition k → k + 1 of a candidate, written into `a` (allocation-free). */
export function transitionActivity(s: CandidateShape, k: number, p: GlitchProcess, a: Activity = { wOn: 0, wOff: 0, toggled: 0, alpha: 0 }): Activity {
  const n = s.bits
  switch (s.topology) {
    case 'string': {
      if (s.decode === 'direct') {
        return set(a, 0, 0, 2, p.tapChargeFraction)
      }
      const j = trailingOnes(k, n)
      return set(a, 2 ** j, 2 ** j - 1, 2 * (j + 1), p.tapChargeFraction)
    }
    case 'r2r-voltage':
    case 'r2r-current': {
      const j = trailingOnes(k, n)
      return set(a, 2 ** j, 2 ** j - 1, j + 1, p.legChargeFraction)
    }
    case 'segmented': {
      // j = L: a segment boundary, one unary leg (2^L) on and all L binary bits off
      const j = trailingOnes(k, lowBits(s))
      return set(a, 2 ** j, 2 ** j - 1, j + 1, p.legChargeFraction)
    }
    case 'two-stage-string': {
      const l = lowBits(s)
      return trailingOnes(k, l) === l ? set(a, 2 ** l, 2 ** l - 1, 6, p.tapChargeFraction) : set(a, 0, 0, 2, p.tapChargeFraction)
    }
  }
}

/** Skew term (V·s) of one transition. */
export function skewImpulseVs(a: Activity, vLsbV: number, skewS: number, trace?: Trace, key = 'glitchSkewVs'): number {
  return F.skew.use({ W_on: a.wOn, W_off: a.wOff, V_LSB: vLsbV, dt: skewS }, trace, key)
}

/** Charge term (V·s) of one transition into an output of Thevenin resistance `routOhm`. */
export function chargeImpulseVs(a: Activity, chargeC: number, routOhm: number, trace?: Trace, key = 'glitchChargeVs'): number {
  return Number.isFinite(routOhm) ? F.charge.use({ alpha: a.alpha, n_tog: a.toggled, q_sw: chargeC, R_out: routOhm }, trace, key) : 0
}

/** Per-transition glitch of all 2^N − 1 transitions (index k = transition k → k + 1). */
export interface GlitchTable {
  totalVs: Float64Array
  skewVs: Float64Array
  chargeVs: Float64Array
  toggled: Float64Array
}

/**
 * Glitch impulse of every one-code transition. The activity of k → k + 1 depends only on the
 * number j of trailing ones of k (capped at the binary section's width), so it is tabulated once
 * per j; j = 31 − clz32(k ⊕ (k + 1)). The charge term is linear in R_out, so the registry
 * formula is evaluated once per j at R_out = 1 Ω (x·1 is exact) and scaled by each code's R_out:
 * the same product, in the same order, as evaluating it per transition.
 * @param routOhm per-code output resistance (ohms) used for the charge term
 */
export function glitchTable(s: CandidateShape, vLsbV: number, routOhm: ArrayLike<number>, p: GlitchProcess): GlitchTable {
  const count = 2 ** s.bits - 1
  const t: GlitchTable = { totalVs: new Float64Array(count), skewVs: new Float64Array(count), chargeVs: new Float64Array(count), toggled: new Float64Array(count) }
  const cap = s.topology === 'segmented' || s.topology === 'two-stage-string' ? lowBits(s) : s.bits
  const skewByJ = new Float64Array(cap + 1)
  const toggledByJ = new Float64Array(cap + 1)
  const chargePerOhmByJ = new Float64Array(cap + 1)
  for (let j = 0; j <= cap; j++) {
    // the lowest code with j trailing ones (capped) has the activity of every such transition
    const a = transitionActivity(s, 2 ** j - 1, p)
    skewByJ[j] = skewImpulseVs(a, vLsbV, p.switchSkewS)
    toggledByJ[j] = a.toggled
    chargePerOhmByJ[j] = chargeImpulseVs(a, p.switchChargeC, 1)
  }
  for (let k = 0; k < count; k++) {
    const j = Math.min(cap, 31 - Math.clz32(k ^ (k + 1)))
    const r = routOhm[k + 1]!
    const charge = Number.isFinite(r) ? chargePerOhmByJ[j]! * r : 0
    t.skewVs[k] = skewByJ[j]!
    t.chargeVs[k] = charge
    t.totalVs[k] = skewByJ[j]! + charge
    t.toggled[k] = toggledByJ[j]!
  }
  return t
}

/** Log-spaced histogram of impulses: 4 bins per decade from 1e-21 V·s; zeros counted apart. */
export function glitchDistribution(values: ArrayLike<number>): { zeroCount: number, edgesVs: number[], counts: number[] } {
  const perDecade = 4
  const lowExp = -21
  const bins = 18 * perDecade
  const counts = new Array<number>(bins).fill(0)
  let zeroCount = 0
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!
    if (v <= 0) {
      zeroCount++
      continue
    }
    const b = Math.floor((Math.log10(v) - lowExp) * perDecade)
    counts[Math.max(0, Math.min(bins - 1, b))]!++
  }
  const edgesVs = Array.from({ length: bins + 1 }, (_, i) => 10 ** (lowExp + i / perDecade))
  return { zeroCount, edgesVs, counts }
}
