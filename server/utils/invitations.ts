import { createHash, randomBytes } from 'node:crypto'
import bcrypt from 'bcryptjs'
import type { InvitationCreate } from '#shared/schemas/team'
import type { SessionUser } from '#shared/types/auth'
import type { InvitationPreviewDto } from '#shared/types/team'
import { invitationForExistingAccountMail, invitationMail } from '../mail/templates'

const ROLE_WORDS = { admin: 'an admin', architect: 'an architect', engineer: 'an engineer', manager: 'a program manager' } as const

function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex')
}

/**
 * Creates the invitation and queues its e-mail in one transaction; 409 if the address is already a
 * member of this team. An address with an account in another team gets the same answer as a new
 * one (the admin must not learn who uses Rungwise elsewhere): the row is stored alike, but its
 * mail carries no link and tells the recipient what to do instead.
 */
export async function inviteMember(admin: SessionUser, body: InvitationCreate): Promise<number> {
  const { appUrl, invitationMaxAgeS } = useRuntimeConfig()
  const token = randomBytes(32).toString('base64url')
  const expiresAt = new Date(Date.now() + invitationMaxAgeS * 1000)
  return writeTransaction(async (trx) => {
    const existing = await trx('users').where({ email: body.email }).first('id', 'team_id')
    if (existing && existing.team_id === admin.teamId) {
      throw createError({ statusCode: 409, statusMessage: 'Already a member', message: 'email: this address is already a member of your team' })
    }
    const [id] = await trx('invitations').insert({
      team_id: admin.teamId, email: body.email, display_name: body.name, role: body.role,
      token_hash: hashToken(token), expires_at: expiresAt, invited_by: admin.id
    })
    const about = { teamName: admin.teamName, inviterName: admin.name, inviteeName: body.name, role: ROLE_WORDS[body.role] }
    const mail = existing
      ? invitationForExistingAccountMail(about)
      : invitationMail({ ...about, url: `${appUrl.replace(/\/$/, '')}/invite/${token}`, expiresAt })
    await queueMail(trx, { ...mail, teamId: admin.teamId, to: body.email, template: 'invitation' })
    await writeAudit({ teamId: admin.teamId, actorId: admin.id, action: 'member_invited', targetType: 'invitation', targetId: id!, detail: { email: body.email, role: body.role } }, trx)
    return id!
  })
}

/** The open invitation behind a link: 404 when unknown, 410 when used or expired. */
export async function findInvitation(token: string) {
  const row = await useDb()('invitations as i').join('teams as t', 't.id', 'i.team_id').where('i.token_hash', hashToken(token))
    .first('i.id', 'i.team_id', 'i.email', 'i.display_name', 'i.role', 'i.expires_at', 'i.accepted_at', 't.name as team_name')
  if (!row) throw createError({ statusCode: 404, statusMessage: 'This invitation link is not valid' })
  if (row.accepted_at || new Date(row.expires_at).getTime() < Date.now()) {
    throw createError({ statusCode: 410, statusMessage: 'This invitation link has been used or has expired; ask your admin for a new one' })
  }
  return row
}

export function toInvitationPreview(row: Awaited<ReturnType<typeof findInvitation>>): InvitationPreviewDto {
  return { email: row.email, name: row.display_name, role: row.role, teamName: row.team_name, expiresAt: new Date(row.expires_at).toISOString() }
}

/** Sets the password once: creates the active user and closes the invitation, atomically. */
export async function acceptInvitation(token: string, password: string): Promise<void> {
  const passwordHash = await bcrypt.hash(password, 12)
  await writeTransaction(async (trx) => {
    const row = await trx('invitations').where({ token_hash: hashToken(token) }).whereNull('accepted_at').where('expires_at', '>', new Date()).forUpdate().first()
    if (!row) throw createError({ statusCode: 410, statusMessage: 'This invitation link has been used or has expired; ask your admin for a new one' })
    if (await trx('users').where({ email: row.email }).first('id')) {
      throw createError({ statusCode: 409, statusMessage: 'Already a member', message: 'email: someone with this address already has an account' })
    }
    const [userId] = await trx('users').insert({ team_id: row.team_id, email: row.email, display_name: row.display_name, password_hash: passwordHash, role: row.role, active: true })
    await trx('invitations').where({ id: row.id }).update({ accepted_at: new Date() })
    await writeAudit({ teamId: row.team_id, actorId: userId!, action: 'invitation_accepted', targetType: 'user', targetId: userId! }, trx)
  })
}
