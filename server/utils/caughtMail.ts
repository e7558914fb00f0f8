import { readdir, readFile } from 'node:fs/promises'
import { join } from 'node:path'
import type { SessionUser } from '#shared/types/auth'
import type { CaughtMailDto } from '#shared/types/team'

/** What replaces an invitation link's token when the mail is shown to anyone but its recipient. */
export const INVITATION_LINK_HIDDEN = '(link shown only to the invited person)'

const OUTBOX_ID = /^<outbox-(\d+)@rungwise\.invalid>$/

/** Removes the one-time token from every invitation link in a text (the link is a credential). */
export function hideInvitationTokens(text: string): string {
  return text.replace(/\/invite\/[\w-]+/g, `/invite/${INVITATION_LINK_HIDDEN}`)
}

async function readCaught(dir: string, newest: number): Promise<CaughtMailDto[]> {
  const names = (await readdir(dir).catch(() => [])).filter(n => n.endsWith('.json')).sort().reverse().slice(0, newest)
  // A file removed or rewritten while we read it is skipped, not a 500.
  const read = await Promise.all(names.map(n => readFile(join(dir, n), 'utf8').then(t => JSON.parse(t) as CaughtMailDto, () => null)))
  return read.filter((m): m is CaughtMailDto => m !== null)
}

/**
 * The caught mail the reader's team sent, newest first: a caught message counts only when its
 * Message-ID names an outbox row of that team (mail of other teams, and anything else the catcher
 * received, is never shown). Invitation links lose their token: it is only for the invitee.
 */
export async function caughtMailForTeam(user: SessionUser, dir: string): Promise<CaughtMailDto[]> {
  const caught = (await readCaught(dir, 500)).map(m => ({ m, outboxId: Number(OUTBOX_ID.exec(m.messageId ?? '')?.[1] ?? 0) }))
  const ids = caught.map(c => c.outboxId).filter(id => id > 0)
  const rows: { id: number, template: string, to_address: string }[] = ids.length
    ? await useDb()('mail_outbox').whereIn('id', ids).where({ team_id: user.teamId }).select('id', 'template', 'to_address')
    : []
  const byId = new Map(rows.map(r => [r.id, r]))
  return caught.filter(c => byId.has(c.outboxId)).slice(0, 50).map(({ m, outboxId }) => {
    if (byId.get(outboxId)!.template !== 'invitation') return m
    return { ...m, text: hideInvitationTokens(m.text), html: hideInvitationTokens(m.html) }
  })
}
