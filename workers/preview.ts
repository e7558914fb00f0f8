import { ZodError } from 'zod'
import { formatIssues } from '#shared/core/contract/errors'
import { evaluateSpec, parseEvaluateInput } from '#shared/core/evaluate'
import { applyFindings } from '#shared/findings/index'
import type { EvaluateOutputWithFindings } from '#shared/findings/index'

/** What a live preview answers: the analytic result with findings, or the field issues. */
export type PreviewAnswer
  = | { ok: true, result: EvaluateOutputWithFindings }
    | { ok: false, issues: { path: string, message: string }[] }

/** A request to the preview worker; `seq` lets the caller drop answers that arrive out of date. */
export interface PreviewRequest { seq: number, raw: unknown }
export type PreviewReply = PreviewAnswer & { seq: number }

/**
 * The live-preview computation: the inputs as the study holds them, forced to the analytic path
 * (`trials = 0`), then the built-in rule packs. Runs in the preview worker, or in-process where
 * no Worker exists (tests).
 */
export async function computePreview(raw: unknown): Promise<PreviewAnswer> {
  const value = (raw ?? {}) as { options?: Record<string, unknown> }
  try {
    const input = parseEvaluateInput({ ...value, options: { ...value.options, trials: 0 } })
    return { ok: true, result: await applyFindings(input, evaluateSpec(input)) }
  } catch (e) {
    if (e instanceof ZodError) return { ok: false, issues: formatIssues(e).issues }
    return { ok: false, issues: [{ path: '(input)', message: e instanceof Error ? e.message : String(e) }] }
  }
}
