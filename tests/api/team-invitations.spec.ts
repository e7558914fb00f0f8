import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'
import { startCatcherProcess, stopCatcher, waitForMail } from '../support/mail-catcher'
import { createTeam } from '../support/teams'

let db: Knex
let admin: string
beforeAll(async () => {
  db = testDb()
  admin = await signIn(DEMO.admin)
})
afterAll(async () => {
  await db.destroy()
})

const unique = (tag: string) => `${tag}-${Date.now()}-${Math.floor(Math.random() * 1e6)}@harrowlake.example`
const tokenFrom = (text: string) => /\/invite\/([\w-]+)/.exec(text)?.[1] ?? ''

describe('invitations', () => {
  it('lets an admin invite a member, mails a one-time link with text and HTML parts, and the link sets a password once', async () => {
    const email = unique('new')
    const res = await api('/api/team/invitations', { method: 'POST', cookie: admin, body: { email, name: 'Rowan Hale', role: 'engineer' } })
    expect(res.status).toBe(201)
    const mail = await waitForMail(inject('mailDir'), email)
    expect(mail.subject).toContain('Harrow Lake Instruments')
    expect(mail.html).toContain('Choose your password')
    const token = tokenFrom(mail.text)
    expect(token.length).toBeGreaterThan(20)
    expect(tokenFrom(mail.html)).toBe(token)
    const preview = await api<{ email: string, role: string }>(`/api/invitations/${token}`)
    expect(preview.body).toMatchObject({ email, role: 'engineer' })
    expect((await api(`/api/invitations/${token}/accept`, { method: 'POST', body: { password: 'short' } })).status).toBe(400)
    expect((await api(`/api/invitations/${token}/accept`, { method: 'POST', body: { password: 'a-long-enough-password' } })).status).toBe(201)
    const cookie = await signIn(email, 'a-long-enough-password')
    const session = await api<{ role: string }>('/api/auth/session', { cookie })
    expect(session.body.role).toBe('engineer')
    // The link works once.
    expect((await api(`/api/invitations/${token}/accept`, { method: 'POST', body: { password: 'another-long-password' } })).status).toBe(410)
    expect((await api(`/api/invitations/${token}`)).status).toBe(410)
  })

  it('refuses an expired link with 410 and an unknown one with 404', async () => {
    const email = unique('late')
    await api('/api/team/invitations', { method: 'POST', cookie: admin, body: { email, name: 'Late Comer', role: 'manager' } })
    const token = tokenFrom((await waitForMail(inject('mailDir'), email)).text)
    await db('invitations').where({ email }).update({ expires_at: new Date(Date.now() - 1000) })
    expect((await api(`/api/invitations/${token}`)).status).toBe(410)
    expect((await api(`/api/invitations/${token}/accept`, { method: 'POST', body: { password: 'a-long-enough-password' } })).status).toBe(410)
    expect((await api('/api/invitations/not-a-real-token-0123456789')).status).toBe(404)
  })

  it('lets only admins invite, and refuses an existing member\'s address with 409', async () => {
    const architect = await signIn(DEMO.architect)
    expect((await api('/api/team/invitations', { method: 'POST', cookie: architect, body: { email: unique('x'), name: 'X', role: 'engineer' } })).status).toBe(403)
    const dup = await api<{ message: string }>('/api/team/invitations', { method: 'POST', cookie: admin, body: { email: DEMO.engineer, name: 'Dup', role: 'engineer' } })
    expect(dup.status).toBe(409)
    const bad = await api<{ message: string }>('/api/team/invitations', { method: 'POST', cookie: admin, body: { email: 'not-an-address', name: '', role: 'owner' } })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toContain('email')
  })

  // Issue 13, finding 8: inviting an address with an account in another team answered 409
  // "already has an account", telling the admin who uses Rungwise elsewhere.
  it('answers an address of another team exactly as a new one, and mails its owner what to do instead of a link', async () => {
    const other = await createTeam(db, 'invitereveal')
    const fresh = await api<{ id: number }>('/api/team/invitations', { method: 'POST', cookie: admin, body: { email: unique('fresh'), name: 'Fresh', role: 'engineer' } })
    const taken = await api<{ id: number }>('/api/team/invitations', { method: 'POST', cookie: admin, body: { email: other.users.engineer.email.toUpperCase(), name: 'Taken', role: 'engineer' } })
    expect(taken.status).toBe(fresh.status)
    expect(Object.keys(taken.body)).toEqual(Object.keys(fresh.body))
    const mail = await waitForMail(inject('mailDir'), other.users.engineer.email)
    expect(tokenFrom(mail.text)).toBe('')
    expect(mail.text).toContain('already has a Rungwise account in another team')
    // the account stays where it is
    expect((await db('users').where({ id: other.users.engineer.id }).first('team_id')).team_id).toBe(other.id)
  })

  it('keeps the invitation when the mail service is down and delivers the mail once it is back', async () => {
    const dir = inject('mailDir')
    const port = inject('mailPort')
    await stopCatcher(dir, port)
    const email = unique('retry')
    try {
      expect((await api('/api/team/invitations', { method: 'POST', cookie: admin, body: { email, name: 'Patient Person', role: 'architect' } })).status).toBe(201)
      // The action is recorded even though sending fails; the outbox row waits for a retry.
      const deadline = Date.now() + 15_000
      let row = await db('mail_outbox').where({ to_address: email }).first()
      while (Date.now() < deadline && !(row?.attempts > 0)) {
        await new Promise(r => setTimeout(r, 100))
        row = await db('mail_outbox').where({ to_address: email }).first()
      }
      expect(row.status).toBe('pending')
      expect(row.attempts).toBeGreaterThan(0)
      expect(row.last_error).toBeTruthy()
      expect(await db('invitations').where({ email }).first('id')).toBeTruthy()
    } finally {
      await startCatcherProcess(port, dir)
    }
    // Retry at once rather than after the back-off (what a later tick would do).
    await db('mail_outbox').where({ to_address: email }).update({ next_attempt_at: new Date() })
    const mail = await waitForMail(dir, email)
    expect(tokenFrom(mail.text)).not.toBe('')
    expect((await db('mail_outbox').where({ to_address: email }).first()).status).toBe('sent')
  })

  it('shows admins what the local catcher caught, and nobody else', async () => {
    const list = await api<{ subject: string }[]>('/api/admin/mail', { cookie: admin })
    expect(list.status).toBe(200)
    expect(list.body.length).toBeGreaterThan(0)
    expect((await api('/api/admin/mail', { cookie: await signIn(DEMO.engineer) })).status).toBe(403)
  })

  // Issue 13, finding 1: the list showed every team's mail with live invitation links, so another
  // team's admin could accept one and join this team as admin.
  it('shows an admin only their own team\'s caught mail, and never an invitation token', async () => {
    const email = unique('scoped')
    expect((await api('/api/team/invitations', { method: 'POST', cookie: admin, body: { email, name: 'Scoped Invitee', role: 'admin' } })).status).toBe(201)
    const token = tokenFrom((await waitForMail(inject('mailDir'), email)).text)
    expect(token.length).toBeGreaterThan(20)
    const other = await createTeam(db, 'mailscope')
    const otherAdmin = await signIn(other.users.admin.email, other.password)
    const theirs = await api<{ to: string[], text: string, html: string }[]>('/api/admin/mail', { cookie: otherAdmin })
    expect(theirs.status).toBe(200)
    expect(theirs.body.filter(m => m.to.includes(email))).toEqual([])
    expect(JSON.stringify(theirs.body)).not.toContain(token)
    const ours = await api<{ to: string[], text: string, html: string }[]>('/api/admin/mail', { cookie: admin })
    const invitation = ours.body.find(m => m.to.includes(email))!
    expect(invitation.text).toContain('/invite/')
    expect(JSON.stringify(ours.body)).not.toContain(token)
    // no other team's address appears in the demo team's list either
    expect(ours.body.flatMap(m => m.to).filter(t => t.endsWith('@mailscope.example'))).toEqual([])
  })

  it('lists team members for everyone and open invitations only for admins', async () => {
    const asAdmin = await api<{ members: unknown[], invitations: unknown[] }>('/api/team', { cookie: admin })
    expect(asAdmin.body.members.length).toBeGreaterThanOrEqual(4)
    expect(asAdmin.body.invitations.length).toBeGreaterThan(0)
    const asManager = await api<{ members: unknown[], invitations: unknown[] }>('/api/team', { cookie: await signIn(DEMO.manager) })
    expect(asManager.body.invitations).toEqual([])
  })
})
