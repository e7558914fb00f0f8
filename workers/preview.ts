import { ZodError } from 'zod'
import { formatIssues } from '#shared/core/contract/errors'
import { evaluateSpec, parseEvaluateInput } from '#shared/core/evaluate'
import { applyFindings } from '#shared/findings/index'
import type { EvaluateOutputWithFindings, RulePack } from '#shared/findings/index'
import { checkRulePack } from '#shared/findings/validate'

/** What a live preview answers: the analytic result with findings, or the field issues. */
export type PreviewAnswer
  = | { ok: true, result: EvaluateOutputWithFindings }
    | { ok: false, issues: { path: string, message: string }[] }

/** A team's enabled rule pack as the rule-pack API lists it. */
export interface StoredTeamPack { packId: string, version: number, pack: unknown }

/** A request to the preview worker; `seq` lets the caller drop answers that arrive out of date. */
export interface PreviewRequest { seq: number, raw: unknown, packs?: StoredTeamPack[] }

/** The stored packs that still validate, as the server's enabledTeamPacks reads them. */
function teamPacks(stored: StoredTeamPack[]): RulePack[] {
  return stored.flatMap((s) => {
    const check = checkRulePack(s.pack, `team pack ${s.packId}`)
    return check.ok ? [{ ...check.pack, id: s.packId, version: s.version, source: 'team' as const }] : []
  })
}
export type PreviewReply = PreviewAnswer & { seq: number }

/**
 * The live-preview computation: the inputs as the study holds them, forced to the analytic path
 * (`trials = 0`), then the built-in rule packs and the team's enabled ones (as the server runs
 * them, so findings never differ by view). Runs in the preview worker, or in-process where no
 * Worker exists (tests).
 */
export async function computePreview(raw: unknown, stored: StoredTeamPack[] = []): Promise<PreviewAnswer> {
  const value = (raw ?? {}) as { options?: Record<string, unknown> }
  try {
    const input = parseEvaluateInput({ ...value, options: { ...value.options, trials: 0 } })
    return { ok: true, result: await applyFindings(input, evaluateSpec(input), teamPacks(stored)) }
  } catch (e) {
    if (e instanceof ZodError) return { ok: false, issues: formatIssues(e).issues }
    return { ok: false, issues: [{ path: '(input)', message: e instanceof Error ? e.message : String(e) }] }
  }
}
