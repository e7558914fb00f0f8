import { readFileSync } from 'node:fs'
import { gunzipSync } from 'node:zlib'
import { describe, expect, it } from 'vitest'
import { evaluateSpec, parseEvaluateInput } from '#shared/core/evaluate'
import { REGRESSION_CASES } from './fixtures/regression-cases'

// Recorded from the engine before the Monte Carlo / analytic speed work (scripts/bench/record-regression.ts):
// "derived" — the reference is the earlier code path itself, so any change beyond rounding shows here.
const RECORDED = JSON.parse(gunzipSync(readFileSync(new URL('./fixtures/evaluate-regression.json.gz', import.meta.url))).toString('utf8')) as Record<string, unknown>

const REL = 1e-12
// absolute floor for values that are rounding noise around zero (LSB, volts, amps, seconds: all ≫ 1e-30 where they matter)
const ABS = 1e-30

function mismatches(path: string, want: unknown, got: unknown, out: string[]): void {
  if (out.length > 20) return
  if (typeof want === 'number' && typeof got === 'number') {
    const ok = want === got || Math.abs(want - got) <= REL * Math.max(Math.abs(want), Math.abs(got)) + ABS
    if (!ok) out.push(`${path}: ${want} → ${got}`)
    return
  }
  if (Array.isArray(want) || (want !== null && typeof want === 'object')) {
    if (got === null || typeof got !== 'object' || Array.isArray(want) !== Array.isArray(got)) {
      out.push(`${path}: shape differs`)
      return
    }
    const w = want as Record<string, unknown>
    const g = got as Record<string, unknown>
    const keys = new Set([...Object.keys(w), ...Object.keys(g)])
    for (const k of keys) mismatches(`${path}.${k}`, w[k], g[k], out)
    return
  }
  if (want !== got) out.push(`${path}: ${String(want)} → ${String(got)}`)
}

describe('evaluate output against the recorded reference', () => {
  for (const [name, raw] of Object.entries(REGRESSION_CASES)) {
    it(`reproduces ${name} to rounding (relative 1e-12)`, () => {
      // round-trip through JSON as the recording did (Infinity → null, like the API)
      const got = JSON.parse(JSON.stringify(evaluateSpec(parseEvaluateInput(raw)))) as unknown
      const out: string[] = []
      mismatches('output', RECORDED[name], got, out)
      expect(out).toEqual([])
    })
  }
})
