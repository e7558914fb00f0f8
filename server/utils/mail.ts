import type { Knex } from 'knex'
import nodemailer, { type Transporter } from 'nodemailer'
import type { MailContent } from '../mail/templates'

/** Attempts before a message is marked failed; waits double from 5 s up to one hour. */
export const MAIL_MAX_ATTEMPTS = 8
const CLAIM_TIMEOUT_MS = 5 * 60 * 1000

let transport: Transporter | undefined

function useTransport(): Transporter {
  if (!transport) {
    const url = new URL(useRuntimeConfig().smtpUrl)
    transport = nodemailer.createTransport({
      host: url.hostname, port: Number(url.port || 25), secure: url.protocol === 'smtps:',
      auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
      ignoreTLS: url.protocol === 'smtp:' && ['127.0.0.1', 'localhost'].includes(url.hostname),
      connectionTimeout: 5000, greetingTimeout: 5000, socketTimeout: 10_000
    })
  }
  return transport
}

/**
 * The Message-ID a queued message is sent with: it names the outbox row, so whatever shows caught
 * mail in the app can tell whose team a message belongs to (server/utils/caughtMail.ts).
 */
export function outboxMessageId(id: number): string {
  return `<outbox-${id}@rungwise.invalid>`
}

/** Queues a message in the caller's transaction, so it exists exactly when the action does. */
export async function queueMail(trx: Knex.Transaction, message: MailContent & { teamId: number | null, to: string, template: string }): Promise<void> {
  await trx('mail_outbox').insert({
    team_id: message.teamId, template: message.template, to_address: message.to,
    subject: message.subject, text_body: message.text, html_body: message.html
  })
}

/** Claims due messages (rows locked by another instance are skipped) and marks them sending. */
async function claimDue(limit: number): Promise<{ id: number, to_address: string, subject: string, text_body: string, html_body: string, attempts: number }[]> {
  return writeTransaction(async (trx) => {
    const now = new Date()
    const rows = await trx('mail_outbox')
      .where(q => q.where({ status: 'pending' }).andWhere('next_attempt_at', '<=', now))
      .orWhere(q => q.where({ status: 'sending' }).andWhere('claimed_at', '<', new Date(now.getTime() - CLAIM_TIMEOUT_MS)))
      .orderBy('id').limit(limit).forUpdate().skipLocked()
      .select('id', 'to_address', 'subject', 'text_body', 'html_body', 'attempts')
    if (rows.length) await trx('mail_outbox').whereIn('id', rows.map(r => r.id)).update({ status: 'sending', claimed_at: now })
    return rows
  })
}

/** Sends what is due; failures are retried later with a growing wait. Returns the number sent. */
export async function deliverDueMail(limit = 20): Promise<number> {
  const { mailFrom } = useRuntimeConfig()
  let sent = 0
  for (const row of await claimDue(limit)) {
    try {
      await useTransport().sendMail({ messageId: outboxMessageId(row.id), from: mailFrom, to: row.to_address, subject: row.subject, text: row.text_body, html: row.html_body })
      await useDb()('mail_outbox').where({ id: row.id }).update({ status: 'sent', sent_at: new Date(), attempts: row.attempts + 1, last_error: null })
      sent += 1
    } catch (error) {
      const attempts = row.attempts + 1
      const waitMs = Math.min(5000 * 2 ** (attempts - 1), 3_600_000)
      await useDb()('mail_outbox').where({ id: row.id }).update({
        status: attempts >= MAIL_MAX_ATTEMPTS ? 'failed' : 'pending', attempts,
        next_attempt_at: new Date(Date.now() + waitMs), last_error: String((error as Error)?.message ?? error).slice(0, 1000)
      })
    }
  }
  return sent
}
