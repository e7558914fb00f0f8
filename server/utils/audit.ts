import type { Knex } from 'knex'

export interface AuditEntry {
  teamId: number | null
  actorId: number | null
  action: string
  targetType: string
  targetId: number | string | null
  detail?: Record<string, unknown>
}

/** Appends one audit-log row; pass the transaction when the action is part of one. */
export async function writeAudit(entry: AuditEntry, trx?: Knex.Transaction): Promise<void> {
  await (trx ?? useDb())('audit_log').insert({
    team_id: entry.teamId,
    actor_id: entry.actorId,
    action: entry.action,
    target_type: entry.targetType,
    target_id: entry.targetId === null ? null : String(entry.targetId),
    detail: entry.detail ? JSON.stringify(entry.detail) : null
  })
}
