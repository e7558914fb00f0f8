import type { TeamDto } from '#shared/types/team'

/** The team's members (everyone may see who is on the team); open invitations for admins. */
export default defineApiHandler(async (event): Promise<TeamDto> => {
  const user = await requireUser(event)
  const db = useDb()
  const members = await db('users').where({ team_id: user.teamId }).orderBy('display_name').select('id', 'display_name', 'email', 'role', 'active')
  const invitations = user.role !== 'admin'
    ? []
    : await db('invitations as i').leftJoin('users as u', 'u.id', 'i.invited_by').where('i.team_id', user.teamId)
        .whereNull('i.accepted_at').where('i.expires_at', '>', new Date()).orderBy('i.created_at', 'desc')
        .select('i.id', 'i.display_name', 'i.email', 'i.role', 'i.expires_at', 'u.display_name as invited_by')
  return {
    members: members.map(m => ({ id: m.id, name: m.display_name, email: m.email, role: m.role, active: Boolean(m.active) })),
    invitations: invitations.map(i => ({ id: i.id, name: i.display_name, email: i.email, role: i.role, expiresAt: new Date(i.expires_at).toISOString(), invitedBy: i.invited_by }))
  }
})
