/**
 * Glitch summary of one candidate from the per-transition table (models/glitch.ts): the worst
 * transition and its parts, the major-carry value, switch activity, the distribution over all
 * transitions and a decimated per-transition series for charts.
 */
import type { GlitchProcess } from '../models/glitch'
import { glitchDistribution, glitchTable } from '../models/glitch'
import type { CandidateShape } from '../models/shapes'
import type { DecimatedSeries } from '../stats/envelope'
import { decimateSeries } from '../stats/envelope'

/** Glitch results (V·s; codes of the worst transition from → to). */
export interface GlitchSummary {
  glitchWorstVs: number
  glitchWorstFromCode: number
  glitchWorstToCode: number
  glitchWorstSkewVs: number
  glitchWorstChargeVs: number
  glitchMajorCarryVs: number
  glitchMeanVs: number
  switchesToggledMax: number
  switchesToggledMean: number
  distribution: { zeroCount: number, edgesVs: number[], counts: number[] }
  perTransition: DecimatedSeries
  /** switches toggled per transition k → k + 1 (decimated: bucket min and max) */
  activity: DecimatedSeries
}

/** Summarises the glitch of every one-code transition of a candidate. */
export function summariseGlitch(s: CandidateShape, vLsbV: number, routOhm: ArrayLike<number>, p: GlitchProcess, points: number): GlitchSummary {
  const t = glitchTable(s, vLsbV, routOhm, p)
  let worst = 0
  let sum = 0
  let toggledMax = 0
  let toggledSum = 0
  for (let k = 0; k < t.totalVs.length; k++) {
    worst = t.totalVs[k]! > t.totalVs[worst]! ? k : worst
    sum += t.totalVs[k]!
    toggledMax = Math.max(toggledMax, t.toggled[k]!)
    toggledSum += t.toggled[k]!
  }
  const count = t.totalVs.length
  return {
    glitchWorstVs: t.totalVs[worst]!,
    glitchWorstFromCode: worst,
    glitchWorstToCode: worst + 1,
    glitchWorstSkewVs: t.skewVs[worst]!,
    glitchWorstChargeVs: t.chargeVs[worst]!,
    glitchMajorCarryVs: t.totalVs[2 ** (s.bits - 1) - 1]!,
    glitchMeanVs: sum / count,
    switchesToggledMax: toggledMax,
    switchesToggledMean: toggledSum / count,
    distribution: glitchDistribution(t.totalVs),
    perTransition: decimateSeries(t.totalVs, points),
    activity: decimateSeries(t.toggled, points)
  }
}
