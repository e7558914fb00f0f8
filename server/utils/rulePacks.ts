import type { Knex } from 'knex'
import { BUILT_IN_PACKS } from '#shared/findings/registry'
import type { RulePack, RulePackDocument } from '#shared/findings/schema'
import { checkRulePack } from '#shared/findings/validate'
import type { Role } from '#shared/types/auth'
import type { BuiltInPackDto, RulePackDto } from '#shared/types/rulePacks'

/** Roles that may create, edit, enable and dry-run team rule packs. */
export const RULE_PACK_WRITER_ROLES: readonly Role[] = ['admin']

interface PackRow { id: number, pack_id: string, name: string, pack: unknown, enabled: number | boolean, version: number, created_at: Date, updated_at: Date }

function parsed(value: unknown): unknown {
  return typeof value === 'string' ? JSON.parse(value) : value
}

export function toRulePackDto(row: PackRow): RulePackDto {
  const pack = parsed(row.pack) as RulePackDocument
  return {
    id: row.id, packId: row.pack_id, name: row.name, enabled: Boolean(row.enabled), version: row.version, pack,
    ruleCount: pack.rules?.length ?? 0, createdAt: new Date(row.created_at).toISOString(), updatedAt: new Date(row.updated_at).toISOString()
  }
}

export function builtInPackDtos(): BuiltInPackDto[] {
  return BUILT_IN_PACKS.map(({ source: _s, ...pack }) => ({ packId: pack.id, name: pack.name, description: pack.description, version: pack.version, pack, ruleCount: pack.rules.length }))
}

export function rulePackNotFound() {
  return createError({ statusCode: 404, statusMessage: MESSAGES.notFound })
}

export function rulePackConflict(message: string, currentVersion?: number) {
  return createError({ statusCode: 409, statusMessage: 'Conflict', message, data: { message, currentVersion } })
}

/** The team's enabled packs, ready to run; a stored pack that no longer validates is skipped and logged. */
export async function enabledTeamPacks(teamId: number): Promise<RulePack[]> {
  const rows: PackRow[] = await useDb()('rule_packs').where({ team_id: teamId, enabled: true }).orderBy('pack_id')
  const packs: RulePack[] = []
  for (const row of rows) {
    const check = checkRulePack(parsed(row.pack), `team pack ${row.pack_id}`)
    if (check.ok) packs.push({ ...check.pack, id: row.pack_id, version: row.version, source: 'team' })
    else console.warn(`[rungwise] skipped rule pack: ${check.message}`)
  }
  return packs
}

/** Appends one history row (inside the write's transaction). */
export async function writePackVersion(trx: Knex.Transaction, rulePackId: number, version: number, pack: RulePackDocument, enabled: boolean, authorId: number, change: string): Promise<void> {
  await trx('rule_pack_versions').insert({ rule_pack_id: rulePackId, version, pack: JSON.stringify(pack), enabled, author_id: authorId, change })
}
