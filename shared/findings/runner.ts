/**
 * Runs rule packs over an evaluation with json-rules-engine and renders each fired rule as a
 * finding: severity, title, explanation and action with the user's numbers, and its basis (the
 * handbook sections and metrics it rests on, the hook for "how was this computed").
 */
import { Engine } from 'json-rules-engine'
import type { RuleProperties } from 'json-rules-engine'
import type { EvaluateCandidate, EvaluateInput } from '../core/contract/evaluate'
import { candidateFacts } from './facts'
import type { CandidateFacts } from './facts'
import type { RulePack, Severity } from './schema'
import { renderTemplate } from './template'

export interface FindingBasis {
  /** handbook sections, e.g. ["§4.3"] */
  handbook: string[]
  /** metric names the finding rests on (`totalAreaMm2`, or `derived.areaToBudget`) */
  metrics: string[]
  /** where the threshold comes from: spec, derived, published, common-practice, memory */
  thresholdSource: string
  thresholdNote: string
}

export interface Finding {
  ruleId: string
  packId: string
  packVersion: number
  severity: Severity
  candidateId: string
  title: string
  explanation: string
  action: string
  basis: FindingBasis
}

export const SEVERITY_ORDER: Record<Severity, number> = { fail: 0, warn: 1, advice: 2, note: 3 }

function engineFor(pack: RulePack): Engine {
  const engine = new Engine([], { allowUndefinedFacts: true })
  for (const rule of pack.rules) {
    engine.addRule({ name: rule.id, conditions: rule.conditions, event: { type: rule.id } } as RuleProperties)
  }
  return engine
}

async function firedRuleIds(engine: Engine, facts: CandidateFacts): Promise<Set<string>> {
  const { events } = await engine.run({ ...facts })
  return new Set(events.map(e => e.type))
}

function toFinding(pack: RulePack, ruleId: string, facts: CandidateFacts): Finding {
  const rule = pack.rules.find(r => r.id === ruleId)!
  const values = facts as unknown as Record<string, Record<string, unknown>>
  return {
    ruleId,
    packId: pack.id,
    packVersion: pack.version,
    severity: rule.severity,
    candidateId: String(facts.candidate.id),
    title: rule.title,
    explanation: renderTemplate(rule.explanation, values),
    action: renderTemplate(rule.action, values),
    basis: { handbook: [...rule.basis.handbook], metrics: [...rule.basis.metrics], thresholdSource: rule.threshold.source, thresholdNote: rule.threshold.note }
  }
}

/** Sorts findings by severity, then candidate, then pack and rule (a stable, readable order). */
export function sortFindings(findings: Finding[]): Finding[] {
  return [...findings].sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity]
    || a.candidateId.localeCompare(b.candidateId) || a.packId.localeCompare(b.packId) || a.ruleId.localeCompare(b.ruleId))
}

/** Findings of every pack over every candidate of one evaluation. */
export async function runFindings(input: EvaluateInput, candidates: readonly EvaluateCandidate[], packs: readonly RulePack[]): Promise<Finding[]> {
  const all = candidateFacts(input, candidates)
  const out: Finding[] = []
  for (const pack of packs) {
    const engine = engineFor(pack)
    for (const facts of all) {
      const fired = await firedRuleIds(engine, facts)
      // Keep the pack's own rule order within a candidate.
      for (const rule of pack.rules) if (fired.has(rule.id)) out.push(toFinding(pack, rule.id, facts))
    }
  }
  return sortFindings(out)
}
