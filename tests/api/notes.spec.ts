import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { PortfolioPage } from '../../shared/types/portfolio'
import { testDb } from '../support/db'
import { api } from '../support/http'
import { cookies, newStudy, saveResults, threads, writeNote, type Cookies, type NoteResponse } from './notes-support'

let db: Knex
let as: Cookies
let studyId: number
const tag = `notes-${Date.now()}`

beforeAll(async () => {
  db = testDb()
  as = await cookies(db, 'crud')
  studyId = await newStudy(as.engineer, `${tag} study`)
})
afterAll(async () => {
  await db.destroy()
})

const patch = (cookie: string, id: number, body: Record<string, unknown>) => api<NoteResponse>(`/api/notes/${id}`, { method: 'PATCH', cookie, body })
const audit = (action: string, noteId: number) => db('audit_log').where({ action, target_type: 'study', target_id: String(studyId) }).whereRaw('JSON_VALUE(detail, \'$.noteId\') = ?', [noteId]).first()

describe('notes', () => {
  it('lets every role write a note and reply in its thread; another team gets 404', async () => {
    const root = await writeNote(as.manager, studyId, { body: 'Why is the **segmented** option ahead?' })
    expect(root.status).toBe(201)
    expect(root.body).toMatchObject({ anchor: { type: 'study' }, parentId: null, version: 1, resolved: null, author: { name: 'Dana Whitcombe' } })
    for (const who of ['admin', 'architect', 'engineer'] as const) {
      expect((await writeNote(as[who], studyId, { body: `reply by ${who}`, parentId: root.body.id })).status).toBe(201)
    }
    const list = await threads(as.engineer, studyId)
    const thread = list.find(t => t.id === root.body.id)!
    expect(thread.replies.map(r => r.body)).toEqual(['reply by admin', 'reply by architect', 'reply by engineer'])
    // replies are one level deep and take the thread's anchor
    const nested = await writeNote(as.engineer, studyId, { body: 'deeper', parentId: thread.replies[0]!.id })
    expect(nested.status).toBe(400)
    expect(nested.body.message).toContain('parentId')
    expect((await api(`/api/studies/${studyId}/notes`, { cookie: as.otherTeam })).status).toBe(404)
    expect((await writeNote(as.otherTeam, studyId, { body: 'not my team' })).status).toBe(404)
    expect((await api(`/api/notes/${root.body.id}/resolve`, { method: 'POST', cookie: as.otherTeam })).status).toBe(404)
    expect(await audit('note.created', root.body.id)).toBeTruthy()
  })

  it('refuses bad bodies and anchors with a 400 naming the field', async () => {
    const empty = await writeNote(as.engineer, studyId, { body: '   ' })
    expect(empty.status).toBe(400)
    expect(empty.body.message).toContain('body')
    const metric = await writeNote(as.engineer, studyId, { body: 'x', anchor: { type: 'metric', candidateId: 'string', metricKey: 'favouriteColour' } })
    expect(metric.status).toBe(400)
    expect(metric.body.message).toContain('anchor.metricKey')
    expect((await writeNote(as.engineer, studyId, { body: 'x'.repeat(10_001) })).status).toBe(400)
    expect((await db('notes').where({ study_id: studyId, body: 'x' }).count({ n: '*' }))[0]!.n).toBe(0)
  })

  it('lets only the author or an admin edit, with 409 on a stale version', async () => {
    const note = (await writeNote(as.engineer, studyId, { body: 'first words' })).body
    expect((await patch(as.architect, note.id, { version: 1, body: 'not yours' })).status).toBe(403)
    expect((await patch(as.manager, note.id, { version: 1, body: 'not yours' })).status).toBe(403)
    const edited = await patch(as.engineer, note.id, { version: 1, body: 'second words' })
    expect(edited.status).toBe(200)
    expect(edited.body).toMatchObject({ version: 2, body: 'second words', bodyHtml: '<p>second words</p>\n' })
    const stale = await patch(as.admin, note.id, { version: 1, body: 'admin on an old copy' })
    expect(stale.status).toBe(409)
    expect(stale.body.data.currentVersion).toBe(2)
    expect((await patch(as.admin, note.id, { version: 2, body: 'admin tidied it' })).status).toBe(200)
    expect((await audit('note.edited', note.id))).toBeTruthy()
    expect((await patch(as.otherTeam, note.id, { version: 3, body: 'x' })).status).toBe(404)
  })

  it('deletes softly (author or admin), keeps who and when in the row and the audit log', async () => {
    const engineerId = (await db('users').where({ email: 'engineer@harrowlake.example' }).first('id')).id
    const note = (await writeNote(as.engineer, studyId, { body: 'to be removed' })).body
    expect((await api(`/api/notes/${note.id}`, { method: 'DELETE', cookie: as.manager })).status).toBe(403)
    expect((await api(`/api/notes/${note.id}`, { method: 'DELETE', cookie: as.engineer })).status).toBe(204)
    const row = await db('notes').where({ id: note.id }).first()
    expect(row.body).toBe('to be removed')
    expect(row.deleted_by).toBe(engineerId)
    expect(row.deleted_at).toBeInstanceOf(Date)
    const entry = await audit('note.deleted', note.id)
    expect(entry.actor_id).toBe(engineerId)
    expect((await threads(as.engineer, studyId)).some(t => t.id === note.id)).toBe(false)
    expect((await patch(as.engineer, note.id, { version: 1, body: 'back?' })).status).toBe(404)
    // an admin deletes anyone's note; a deleted first note stays as an empty placeholder for its replies
    const root = (await writeNote(as.architect, studyId, { body: 'thread to empty' })).body
    await writeNote(as.manager, studyId, { body: 'a reply stays', parentId: root.id })
    expect((await api(`/api/notes/${root.id}`, { method: 'DELETE', cookie: as.admin })).status).toBe(204)
    const kept = (await threads(as.manager, studyId)).find(t => t.id === root.id)!
    expect(kept).toMatchObject({ deleted: true, body: '', bodyHtml: '' })
    expect(kept.replies.map(r => r.body)).toEqual(['a reply stays'])
  })

  it('resolves and reopens a thread (any member), logs both, and the portfolio counts open notes', async () => {
    const own = await newStudy(as.architect, `${tag} portfolio`)
    const open = async () => (await api<PortfolioPage>(`/api/portfolio?q=${encodeURIComponent(`${tag} portfolio`)}`, { cookie: as.manager })).body.items[0]!.openNotes
    expect(await open()).toBe(0)
    const a = (await writeNote(as.engineer, own, { body: 'one' })).body
    await writeNote(as.engineer, own, { body: 'two' })
    await writeNote(as.manager, own, { body: 'a reply is not a thread', parentId: a.id })
    expect(await open()).toBe(2)
    const resolved = await api<NoteResponse>(`/api/notes/${a.id}/resolve`, { method: 'POST', cookie: as.manager })
    expect(resolved.body.resolved?.by).toBe('Dana Whitcombe')
    expect(await open()).toBe(1)
    expect((await db('audit_log').where({ action: 'note.resolved', target_id: String(own) }).count({ n: '*' }))[0]!.n).toBe(1)
    const reopened = await api<NoteResponse>(`/api/notes/${a.id}/reopen`, { method: 'POST', cookie: as.engineer })
    expect(reopened.body.resolved).toBeNull()
    expect(await open()).toBe(2)
    expect((await db('audit_log').where({ action: 'note.reopened', target_id: String(own) }).count({ n: '*' }))[0]!.n).toBe(1)
  })

  it('keeps the revision and the metric value a note discussed, and marks when the number changed since', async () => {
    const own = await newStudy(as.engineer, `${tag} numbers`)
    await saveResults(db, own, 0.25)
    const anchor = { type: 'metric', candidateId: 'string', metricKey: 'inlSigmaLsb' }
    const note = (await writeNote(as.architect, own, { body: 'INL spread looks tight', anchor })).body
    expect(note).toMatchObject({ revision: 1, valueThen: 0.25, changed: false, anchor })
    // a reply keeps the thread's anchor
    expect((await writeNote(as.engineer, own, { body: 'agreed', parentId: note.id })).body.anchor).toEqual(anchor)
    await saveResults(db, own, 0.25)
    expect((await threads(as.engineer, own))[0]).toMatchObject({ changed: false, valueNow: 0.25 })
    await saveResults(db, own, 0.31)
    expect((await threads(as.engineer, own))[0]).toMatchObject({ revision: 1, valueThen: 0.25, valueNow: 0.31, changed: true })
  })
})
