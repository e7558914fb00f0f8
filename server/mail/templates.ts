import { escapeHtml } from '@vue/shared'

/** A rendered message: plain text and HTML parts of the same content. */
export interface MailContent { subject: string, text: string, html: string }

export function layout(title: string, paragraphs: string[], action?: { label: string, url: string }): string {
  const body = paragraphs.map(p => `<p style="margin:0 0 12px">${escapeHtml(p)}</p>`).join('')
  const button = action
    ? `<p style="margin:20px 0"><a href="${escapeHtml(action.url)}" style="background:#12323A;color:#F6F4EE;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(action.label)}</a></p><p style="font-size:12px;color:#5B6B70">Or open ${escapeHtml(action.url)}</p>`
    : ''
  return `<!doctype html><html><body style="font-family:Lexend,Arial,sans-serif;color:#12323A;background:#F6F4EE;padding:24px"><div style="max-width:560px;margin:auto;background:#FFFFFF;border:1px solid #D9D4C7;border-radius:8px;padding:24px"><h1 style="font-size:18px;margin:0 0 16px">${escapeHtml(title)}</h1>${body}${button}<p style="font-size:12px;color:#5B6B70;margin-top:24px">Sent by Rungwise for your team.</p></div></body></html>`
}

export function text(paragraphs: string[], action?: { label: string, url: string }): string {
  return [...paragraphs, ...(action ? [`${action.label}: ${action.url}`] : []), '—', 'Sent by Rungwise for your team.'].join('\n\n')
}

/** Invitation of a new team member: a one-time link to set a password. */
export function invitationMail(data: { teamName: string, inviterName: string, inviteeName: string, role: string, url: string, expiresAt: Date }): MailContent {
  const paragraphs = [
    `Hello ${data.inviteeName},`,
    `${data.inviterName} invited you to join ${data.teamName} on Rungwise as ${data.role}.`,
    `The link below lets you choose your password once. It expires on ${data.expiresAt.toUTCString()}.`
  ]
  const action = { label: 'Choose your password', url: data.url }
  return { subject: `You are invited to ${data.teamName} on Rungwise`, text: text(paragraphs, action), html: layout('Join your team on Rungwise', paragraphs, action) }
}

/**
 * An invitation to an address that already has a Rungwise account in another team: no link (an
 * address belongs to one team), and what the recipient can do instead. The inviting admin gets the
 * same answer as for a new address, so only the owner of the address learns this.
 */
export function invitationForExistingAccountMail(data: { teamName: string, inviterName: string, inviteeName: string, role: string }): MailContent {
  const paragraphs = [
    `Hello ${data.inviteeName},`,
    `${data.inviterName} invited you to join ${data.teamName} on Rungwise as ${data.role}.`,
    'This address already has a Rungwise account in another team, and an address belongs to one team only, so there is no link to accept.',
    `To join ${data.teamName}, ask ${data.inviterName} to invite a different address of yours. If you did not expect this message, you can ignore it.`
  ]
  return { subject: `You are invited to ${data.teamName} on Rungwise`, text: text(paragraphs), html: layout('Join a team on Rungwise', paragraphs) }
}

/** A member was mentioned in a note: who wrote it, where, and the first lines of it. */
export function mentionMail(data: { recipientName: string, authorName: string, studyTitle: string, about: string, excerpt: string, url: string }): MailContent {
  const excerpt = data.excerpt.length > 600 ? `${data.excerpt.slice(0, 600)}…` : data.excerpt
  const paragraphs = [
    `Hello ${data.recipientName},`,
    `${data.authorName} mentioned you in a note on ${data.about} in “${data.studyTitle}”:`,
    excerpt
  ]
  const action = { label: 'Open the note', url: data.url }
  return { subject: `${data.authorName} mentioned you in “${data.studyTitle}”`, text: text(paragraphs, action), html: layout('You were mentioned in a note', paragraphs, action) }
}
