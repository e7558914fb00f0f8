import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { testDb } from '../support/db'
import { api, DEMO } from '../support/http'
import { caughtMail } from '../support/mail-catcher'
import { cookies, newStudy, writeNote, type Cookies, type NoteResponse } from './notes-support'

let db: Knex
let as: Cookies
let studyId: number
const title = `Mention study ${Date.now()}`

beforeAll(async () => {
  db = testDb()
  as = await cookies(db, 'content')
  studyId = await newStudy(as.engineer, title)
})
afterAll(async () => {
  await db.destroy()
})

/** Waits until every mention mail of this study left the outbox, then counts what the catcher holds per address. */
async function mailsByAddress(expectedRows: number): Promise<Record<string, number>> {
  const until = Date.now() + 30_000
  for (;;) {
    const rows = await db('mail_outbox').where({ template: 'mention' }).where('subject', 'like', `%${title}%`).select('status')
    const caught = caughtMail(inject('mailDir')).filter(m => m.subject.includes(title))
    if (rows.length === expectedRows && rows.every(r => r.status === 'sent') && caught.length === expectedRows) {
      const out: Record<string, number> = {}
      for (const m of caught) for (const to of m.to) out[to] = (out[to] ?? 0) + 1
      return out
    }
    if (Date.now() > until) throw new Error(`mention mail did not settle: ${rows.length} rows, ${caught.length} caught`)
    await new Promise(r => setTimeout(r, 150))
  }
}

describe('note mentions', () => {
  it('mails each mentioned team member exactly once, never the author or another team, and an edit only the newly mentioned', async () => {
    const outsider = (await db('users').join('teams', 'teams.id', 'users.team_id').whereNot('teams.slug', 'harrow-lake').first('users.email')).email as string
    const body = `@architect and @manager.\nPlease check this; @engineer is me, @${outsider} is not on the team, @nobody is nobody. Again @architect.`
    const note = await writeNote(as.engineer, studyId, { body })
    expect(note.status).toBe(201)
    expect(note.body.mentions.map(m => m.name).sort()).toEqual(['Dana Whitcombe', 'Tomas Reyne'])
    expect(await mailsByAddress(2)).toEqual({ [DEMO.architect]: 1, [DEMO.manager]: 1 })
    const mail = caughtMail(inject('mailDir')).find(m => m.subject.includes(title) && m.to.includes(DEMO.architect))!
    expect(mail.subject).toBe(`Priya Okafor mentioned you in “${title}”`)
    expect(mail.text).toContain(`/studies/${studyId}#note-${note.body.id}`)
    expect(mail.html).toContain('Open the note')
    // an edit that keeps both mentions and adds the admin mails only the admin
    const edited = await api<NoteResponse>(`/api/notes/${note.body.id}`, { method: 'PATCH', cookie: as.engineer, body: { version: 1, body: `${body} Also @admin.` } })
    expect(edited.status).toBe(200)
    expect(await mailsByAddress(3)).toEqual({ [DEMO.architect]: 1, [DEMO.manager]: 1, [DEMO.admin]: 1 })
    // the same edit saved again mails nobody
    await api(`/api/notes/${note.body.id}`, { method: 'PATCH', cookie: as.engineer, body: { version: 2, body: `${body} Also @admin!` } })
    expect(await mailsByAddress(3)).toEqual({ [DEMO.architect]: 1, [DEMO.manager]: 1, [DEMO.admin]: 1 })
  })

  it('queues the mail in the note\'s transaction: a refused note queues nothing', async () => {
    const before = (await db('mail_outbox').count({ n: '*' }))[0]!.n
    const bad = await writeNote(as.engineer, studyId, { body: '@architect look', anchor: { type: 'metric', candidateId: 'string' } })
    expect(bad.status).toBe(400)
    expect((await db('mail_outbox').count({ n: '*' }))[0]!.n).toBe(before)
  })
})

describe('note markdown', () => {
  it('returns the source beside sanitised HTML, with stored XSS attempts rendered as text or stripped', async () => {
    const attempts = [
      '<script>alert(1)</script>',
      '[click me](javascript:alert(1))',
      '[click me](JaVaScRiPt:alert(1))',
      '<img src=x onerror=alert(1)>',
      '![pic](javascript:alert(1))',
      '[data](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)',
      '<a href="javascript:alert(1)">x</a>',
      '<iframe src="https://example.org"></iframe>'
    ]
    const source = `# Heading\n\n**bold** and https://example.org/x\n\n${attempts.join('\n\n')}`
    const note = await writeNote(as.manager, studyId, { body: source })
    expect(note.status).toBe(201)
    expect(note.body.body).toBe(source)
    const html = note.body.bodyHtml
    expect(html).not.toMatch(/<script/i)
    expect(html).not.toMatch(/<img/i)
    expect(html).not.toMatch(/<iframe/i)
    expect(html).not.toMatch(/<[^>]+\son\w+=/i)
    expect(html).not.toMatch(/<a\b[^>]*href="\s*(javascript|data|vbscript):/i)
    // raw HTML shows as text, the harmless Markdown renders, headings never outrank the page's
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;')
    expect(html).toContain('&lt;img src=x onerror=alert(1)&gt;')
    expect(html).toContain('<strong>bold</strong>')
    expect(html).toContain('<h3>Heading</h3>')
    expect(html).toContain('<a href="https://example.org/x" rel="noopener noreferrer nofollow">')
  })
})
