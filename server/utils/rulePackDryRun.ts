import { evaluateInputSchema } from '#shared/core/contract/evaluate'
import type { EvaluateInput, EvaluateOutput } from '#shared/core/contract/evaluate'
import { runFindings } from '#shared/findings/runner'
import { SAMPLE_DRY_RUN_INPUT } from '#shared/findings/sample'
import type { RulePack } from '#shared/findings/schema'
import type { RulePackDryRun } from '#shared/schemas/rulePacks'
import type { RulePackDryRunDto } from '#shared/types/rulePacks'

async function sampleOf(teamId: number, body: RulePackDryRun): Promise<{ input: EvaluateInput, output: EvaluateOutput, sample: RulePackDryRunDto['sample'] }> {
  if (body.evaluationId !== undefined) {
    const row = await useDb()('evaluations').where({ id: body.evaluationId, team_id: teamId, status: 'done' }).first('input', ...EVALUATION_RESULT_COLUMNS)
    const output = row ? evaluationResultOf<EvaluateOutput>(row) : null
    if (!row || !output) {
      const message = 'evaluationId: must be the id of one of your team\'s finished evaluations'
      throw createError({ statusCode: 400, statusMessage: MESSAGES.invalidInput, message, data: { message, issues: [{ path: 'evaluationId', message: 'must be the id of one of your team\'s finished evaluations' }] } })
    }
    const json = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v)
    return { input: evaluateInputSchema.parse(json(row.input)), output, sample: 'evaluation' }
  }
  const input = body.input ?? evaluateInputSchema.parse(SAMPLE_DRY_RUN_INPUT)
  return { input, output: await evaluateInPool(input), sample: body.input ? 'input' : 'sample' }
}

/** Runs one pack over a sample (an evaluation of the team, a given input, or the built-in sample). */
export async function dryRunPack(teamId: number, pack: RulePack, body: RulePackDryRun): Promise<RulePackDryRunDto> {
  const { input, output, sample } = await sampleOf(teamId, body)
  const findings = await runFindings(input, output.candidates, [pack])
  const fired = Object.fromEntries(pack.rules.map(r => [r.id, findings.filter(f => f.ruleId === r.id).map(f => f.candidateId)]))
  return { packId: pack.id, sample, candidateCount: output.candidates.length, findings, fired }
}
