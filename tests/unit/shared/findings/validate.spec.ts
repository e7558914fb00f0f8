import { describe, expect, it } from 'vitest'
import core from '~~/rules/rungwise-core.json'
import { rulePackCreateSchema } from '#shared/schemas/rulePacks'
import { checkRulePack, loadRulePack, RulePackError } from '#shared/findings/validate'
import { renderTemplate, templateProblem } from '#shared/findings/template'

const rule = (over: Record<string, unknown> = {}) => ({
  id: 'area-tight', severity: 'warn', title: 'Area tight', explanation: 'Area {metrics.totalAreaMm2|mm2}', action: 'Shrink it',
  basis: { handbook: ['§4.6'], metrics: ['totalAreaMm2'] }, threshold: { source: 'common-practice', note: 'team habit' },
  conditions: { all: [{ fact: 'metrics', path: '$.totalAreaMm2', operator: 'greaterThan', value: 0.01 }] }, ...over
})
const pack = (rules: unknown[]) => ({ id: 'team-extra', name: 'Team extra', version: 1, rules })

function refusal(raw: unknown): string {
  try {
    loadRulePack(raw, 'rules/team-extra.json')
  } catch (e) {
    expect(e).toBeInstanceOf(RulePackError)
    return (e as Error).message
  }
  throw new Error('pack was accepted')
}

describe('rule pack validation', () => {
  it('loads the built-in pack', () => {
    expect(checkRulePack(core).ok).toBe(true)
  })

  it.each([
    ['an unknown metric in a condition', { conditions: { all: [{ fact: 'metrics', path: '$.areaMm2', operator: 'lessThan', value: 1 }] } }, 'conditions.all[0].path', 'unknown field of metrics: areaMm2'],
    ['an unknown operator', { conditions: { any: [{ fact: 'spec', path: '$.bits', operator: 'approx', value: 1 }] } }, 'conditions.any[0].operator', 'must be one of equal'],
    ['an unknown placeholder', { explanation: 'Area {metrics.area|mm2}' }, 'explanation', 'unknown field'],
    ['an unknown format', { action: 'Use {spec.bits|furlongs}' }, 'action', 'unknown format'],
    ['a bad severity', { severity: 'error' }, 'severity', 'fail, warn, advice, note'],
    ['a list operator without a list', { conditions: { all: [{ fact: 'candidate', path: '$.topology', operator: 'in', value: 'string' }] } }, 'conditions.all[0].value', 'must be a list'],
    ['a fact reference to an unknown field', { conditions: { all: [{ fact: 'metrics', path: '$.unitWidthUm', operator: 'lessThan', value: { fact: 'process', path: '$.minWide' } }] } }, 'conditions.all[0].value.path', 'unknown field of process'],
    ['a handbook reference that is not a section', { basis: { handbook: ['chapter 4'], metrics: ['totalAreaMm2'] } }, 'basis.handbook[0]', '§4.3']
  ])('refuses %s, naming the file, the rule and the field', (_label, change, field, says) => {
    const message = refusal(pack([rule(), rule({ id: 'broken', ...change })]))
    expect(message).toContain('rules/team-extra.json')
    expect(message).toContain('rule "broken" (rules[1])')
    expect(message).toContain(`field ${field}`)
    expect(message).toContain(says)
  })

  it('refuses repeated rule ids and a built-in pack without a version', () => {
    expect(refusal(pack([rule(), rule()]))).toContain('repeats rule id area-tight')
    expect(refusal({ id: 'x', name: 'X', rules: [rule()] })).toContain('must state its version')
  })

  it('prefixes a team pack issue with the rule id in the API schema', () => {
    const r = rulePackCreateSchema.safeParse({ pack: pack([rule({ severity: 'bad' })]) })
    expect(r.success).toBe(false)
    expect(r.error!.issues[0]!.path).toEqual(['pack', 'rules', 0, 'severity'])
    expect(r.error!.issues[0]!.message).toMatch(/^rule "area-tight": /)
  })

  it('refuses a team pack that takes the built-in pack id', () => {
    const r = rulePackCreateSchema.safeParse({ pack: { ...pack([rule()]), id: 'rungwise-core' } })
    expect(r.error!.issues[0]!.message).toContain('built-in')
  })
})

describe('message templates', () => {
  it('substitutes numbers in engineering units', () => {
    const facts = { metrics: { totalAreaMm2: 0.0023552, routMaxOhm: 640050, glitchWorstVs: 1.28e-9, inlYield: 0.9969 }, spec: { bits: 10 } }
    // formatting convention of DESIGN.md: 3 significant figures with SI prefixes
    expect(renderTemplate('{metrics.totalAreaMm2|mm2} · {metrics.routMaxOhm|ohm} · {metrics.glitchWorstVs|vs} · {metrics.inlYield|yield} · {spec.bits|bits}', facts))
      .toBe('0.00236 mm² · 640 kΩ · 1.28 nV·s · 99.69 % · 10 bits')
    expect(renderTemplate('{metrics.missing|ohm}', facts)).toBe('—')
  })

  it('flags stray braces', () => {
    expect(templateProblem('Area {area}')).toContain('is not a placeholder')
    expect(templateProblem('Area {metrics.totalAreaMm2|mm2}')).toBeNull()
  })
})
