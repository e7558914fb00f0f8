import type { z } from 'zod'

/** One API route as the OpenAPI description shows it; the schemas are the ones the route validates with. */
export interface ApiOperation {
  /** `METHOD /api/path/:param`, as the route file's name gives it */
  route: string
  summary: string
  tag: string
  /** public: no sign-in; session: a signed-in browser session only (tokens refused); user: a session or an API token */
  auth: 'public' | 'session' | 'user'
  /** who may call it beyond being signed in, in words */
  roles?: string
  params?: z.ZodObject
  query?: z.ZodObject
  body?: z.ZodType
  /** a request body the live route accepts (tests/api/openapi.spec.ts sends it) */
  example?: unknown
  /** multipart upload instead of JSON */
  multipart?: boolean
  /** the success status, its meaning, and the body's schema or media type */
  ok: { status: number, description: string, schema?: z.ZodType, type?: string }
}

export const SPEC_EXAMPLE = { bits: 4, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-12, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.99, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }
export const PROCESS_EXAMPLE = { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }
export const EVALUATE_EXAMPLE = { spec: SPEC_EXAMPLE, process: PROCESS_EXAMPLE, options: { topologies: ['r2r-voltage', 'segmented'], trials: 200, seed: 1 } }
export const LADDER_EXAMPLE = { topology: 'r2r-voltage', bits: 3, vrefV: 1, legsOhm: [2e4, 2e4, 2e4], seriesOhm: [1e4, 1e4], terminationOhm: 2e4 }
/** A measured transfer of a 4-bit voltage DAC, one line per code (the shape the bench upload reads). */
export const BENCH_EXAMPLE = `code,voltage\n${Array.from({ length: 16 }, (_, k) => `${k},${(2.5 * k / 16).toFixed(4)}`).join('\n')}\n`
