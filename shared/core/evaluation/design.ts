/**
 * The switch design of a ladder or segmented candidate, chosen as an architect would (handbook
 * §11): every handling and width of switch-design.ts is solved exactly at both switch corners, and
 * the design with the least switch area whose worst-corner nominal INL and DNL stay within
 * SWITCH_ERROR_SHARE of the targets wins; when none does, the one with the smallest error relative
 * to the targets. The user can fix the handling, the width or both (options.switchHandling,
 * options.switchScale).
 */
import type { EvaluateInput } from '../contract/evaluate'
import type { SamplerParams } from '../models/samplers'
import { createSampler } from '../models/samplers'
import type { CandidateShape } from '../models/shapes'
import type { LadderDesignValues, SwitchDesign, SwitchHandling } from '../models/switch-design'
import { SWITCH_ERROR_SHARE, SWITCH_HANDLINGS, designSpace, designValues, hasLegSwitches, switchCorners, switchWidthUnits } from '../models/switch-design'
import { dnlAbsLsb, inlAbsLsb, newLinearityResult } from '../stats/linearity'

/** One design's figures: worst-corner nominal INL and DNL (LSB), its switch area (mm²). */
export interface DesignOption {
  handling: SwitchHandling
  scale: number
  systematicInlLsb: number
  systematicDnlLsb: number
  /** lowest nominal DNL (LSB, signed) at the worst corner: ≤ −1 means non-monotonic */
  systematicDnlMinLsb: number
  switchAreaMm2: number
  withinShare: boolean
}

/** The chosen design of a candidate, with the element values at its worst switch corner. */
export interface CandidateDesign {
  choice: 'auto' | 'given'
  chosen: DesignOption
  /** relative departure of the switches from their design value at the worst corner */
  corner: number
  values: LadderDesignValues
  /** the best design of each handling (for the comparison of handlings) */
  alternatives: DesignOption[]
}

interface Evaluated { option: DesignOption, values: LadderDesignValues, corner: number, badness: number }

function evaluateDesign(s: CandidateShape, d: SwitchDesign, rho: number, input: EvaluateInput, base: SamplerParams): Evaluated {
  const { spec, process } = input
  let worst: Evaluated | null = null
  for (const delta of switchCorners(process.switchSpreadPct)) {
    const values = designValues(s, d, rho, delta)
    const sampler = createSampler(s, { ...base, sigmaUnit: 0, design: values })
    const r = newLinearityResult()
    sampler.run(new Float64Array(sampler.normals), r)
    const inl = inlAbsLsb(r)
    const dnl = dnlAbsLsb(r)
    const badness = Math.max(inl / spec.inlTargetLsb, dnl / spec.dnlTargetLsb)
    if (!worst || badness > worst.badness) {
      const option: DesignOption = {
        handling: d.handling, scale: d.scale, systematicInlLsb: inl, systematicDnlLsb: dnl, systematicDnlMinLsb: r.dnlMinLsb,
        switchAreaMm2: switchWidthUnits(s, values, d.handling) * process.switchAreaUm2 * 1e-6,
        withinShare: badness <= SWITCH_ERROR_SHARE
      }
      worst = { option, values, corner: delta, badness }
    }
  }
  return worst!
}

/** Orders designs by switch area, then width, then handling (none, absorbed, dummy, scaled). */
function cheaper(a: Evaluated, b: Evaluated): boolean {
  const x = a.option
  const y = b.option
  if (Math.abs(x.switchAreaMm2 - y.switchAreaMm2) > 1e-15) return x.switchAreaMm2 < y.switchAreaMm2
  if (x.scale !== y.scale) return x.scale < y.scale
  return SWITCH_HANDLINGS.indexOf(x.handling) < SWITCH_HANDLINGS.indexOf(y.handling)
}

/** Best of a list: the cheapest within the share, else the smallest error (then the cheapest). */
function best(list: Evaluated[]): Evaluated {
  const ok = list.filter(e => e.option.withinShare)
  if (ok.length) return ok.reduce((a, b) => (cheaper(b, a) ? b : a))
  return list.reduce((a, b) => (b.badness < a.badness - 1e-12 || (Math.abs(b.badness - a.badness) <= 1e-12 && cheaper(b, a)) ? b : a))
}

/**
 * The design of one candidate, or null for shapes without leg switches (strings, two-stage).
 * `base` is the candidate's sampler parameters (its design field is ignored).
 */
export function chooseDesign(s: CandidateShape, unitOhm: number, input: EvaluateInput, base: SamplerParams): CandidateDesign | null {
  if (!hasLegSwitches(s)) return null
  const { options, process } = input
  const rho = process.switchOhm / unitOhm
  const space = designSpace(rho).filter(d => (options.switchHandling === 'auto' || d.handling === options.switchHandling)
    && (options.switchScale === 'auto' || d.scale === options.switchScale))
  const given = space.length ? space : [{ handling: 'none' as const, scale: options.switchScale === 'auto' ? 1 : options.switchScale }]
  // Cheapest first; within a handling, stop at the first design within the share.
  const evaluated: Evaluated[] = []
  for (const handling of SWITCH_HANDLINGS) {
    const mine = given.filter(d => d.handling === handling)
    for (const d of mine) {
      const e = evaluateDesign(s, d, rho, input, base)
      evaluated.push(e)
      if (e.option.withinShare) break
    }
  }
  const chosen = best(evaluated)
  const alternatives = SWITCH_HANDLINGS.map(h => evaluated.filter(e => e.option.handling === h)).filter(l => l.length).map(l => best(l).option)
  const fixed = options.switchHandling !== 'auto' || options.switchScale !== 'auto'
  return { choice: fixed ? 'given' : 'auto', chosen: chosen.option, corner: chosen.corner, values: chosen.values, alternatives }
}
