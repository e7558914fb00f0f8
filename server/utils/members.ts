import type { SessionUser } from '#shared/types/auth'
import type { TeamMemberDto } from '#shared/types/team'
import type { MemberUpdate } from '#shared/schemas/team'

function refused(message: string) {
  return createError({ statusCode: 409, statusMessage: 'Conflict', message, data: { message } })
}

/**
 * An admin changes a member of their own team (404 for anyone else): role and/or active, in one
 * transaction with its audit rows (role_changed, member_deactivated, member_reactivated).
 * Admins do not change their own role or deactivate themselves (another admin does), so a team
 * never loses its last admin. Deactivation revokes the member's sessions at once; a role change
 * applies from their next request (the role is read from the user row every time).
 */
export async function updateMember(admin: SessionUser, id: number, change: MemberUpdate): Promise<TeamMemberDto> {
  return writeTransaction(async (trx) => {
    const row = await trx('users').where({ id, team_id: admin.teamId }).forUpdate().first('id', 'display_name', 'email', 'role', 'active')
    if (!row) throw notFound()
    const roleChanges = change.role !== undefined && change.role !== row.role
    const activeChanges = change.active !== undefined && change.active !== Boolean(row.active)
    if (id === admin.id && (roleChanges || activeChanges)) {
      throw refused(`${roleChanges ? 'role' : 'active'}: you cannot change your own ${roleChanges ? 'role' : 'access'}; another admin of the team can`)
    }
    if (roleChanges) {
      await trx('users').where({ id }).update({ role: change.role })
      await writeAudit({ teamId: admin.teamId, actorId: admin.id, action: 'role_changed', targetType: 'user', targetId: id, detail: { email: row.email, from: row.role, to: change.role } }, trx)
    }
    if (activeChanges) {
      await trx('users').where({ id }).update({ active: change.active })
      if (!change.active) await trx('sessions').where({ user_id: id }).whereNull('revoked_at').update({ revoked_at: new Date() })
      await writeAudit({ teamId: admin.teamId, actorId: admin.id, action: change.active ? 'member_reactivated' : 'member_deactivated', targetType: 'user', targetId: id, detail: { email: row.email } }, trx)
    }
    return { id, name: row.display_name, email: row.email, role: change.role ?? row.role, active: change.active ?? Boolean(row.active) }
  })
}
