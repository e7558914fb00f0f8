import { crc32, deflateSync } from 'node:zlib'
import type { Knex } from 'knex'
import PDFDocument from 'pdfkit'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { NoteAttachmentDto } from '../../shared/types/notes'
import { testDb } from '../support/db'
import { api } from '../support/http'
import { cookies, newStudy, threads, writeNote, type Cookies } from './notes-support'

let db: Knex
let as: Cookies
let studyId: number
let noteId: number

beforeAll(async () => {
  db = testDb()
  as = await cookies(db, 'files')
  studyId = await newStudy(as.engineer, `Attachment study ${Date.now()}`)
  noteId = (await writeNote(as.engineer, studyId, { body: 'Bench photos and data attached' })).body.id
})
afterAll(async () => {
  await db.destroy()
})

/** A 2×2 RGB PNG written chunk by chunk as the PNG specification (RFC 2083) lays it out. */
function png(): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data])
    const out = Buffer.alloc(body.length + 8)
    out.writeUInt32BE(data.length, 0)
    body.copy(out, 4)
    out.writeUInt32BE(crc32(body), body.length + 4)
    return out
  }
  const header = Buffer.alloc(13)
  header.writeUInt32BE(2, 0)
  header.writeUInt32BE(2, 4)
  header.set([8, 2, 0, 0, 0], 8)
  const rows = Buffer.from([0, 184, 97, 42, 18, 50, 58, 0, 246, 244, 238, 255, 255, 255])
  return Buffer.concat([Buffer.from([137, 80, 78, 71, 13, 10, 26, 10]), chunk('IHDR', header), chunk('IDAT', deflateSync(rows)), chunk('IEND', Buffer.alloc(0))])
}

/** A PDF made by pdfkit with the PNG above placed on it (pdfkit's own PNG decoder reads it first). */
function pdf(image: Buffer): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ size: 'A6' })
    const parts: Buffer[] = []
    doc.on('data', (b: Buffer) => parts.push(b))
    doc.on('end', () => resolve(Buffer.concat(parts)))
    doc.on('error', reject)
    doc.text('Bench notes').image(image, { width: 40 })
    doc.end()
  })
}

function upload(data: Buffer | string, filename: string, cookie = as.engineer, id = noteId) {
  const form = new FormData()
  form.append('file', new Blob([typeof data === 'string' ? data : new Uint8Array(data)]), filename)
  return api<NoteAttachmentDto & { message: string }>(`/api/notes/${id}/attachments`, { method: 'POST', cookie, body: form })
}

async function download(url: string, cookie = as.manager) {
  const res = await fetch(`${inject('baseUrl')}${url}`, { headers: { cookie } })
  return { res, bytes: Buffer.from(await res.arrayBuffer()) }
}

describe('note attachments', () => {
  it('accepts a real PNG, PDF and CSV and serves the same bytes with the sniffed type, nosniff and a disposition', async () => {
    const image = png()
    const files = [
      { data: image, name: 'bench photo.png', type: 'image/png', disposition: /^inline; filename="bench photo.png"/ },
      { data: await pdf(image), name: 'bench report.pdf', type: 'application/pdf', disposition: /^attachment; filename="bench report.pdf"/ },
      { data: Buffer.from('code,volts\n0,0.000\n1,0.0098\n2,0.0195\n'), name: 'transfer.csv', type: 'text/csv; charset=utf-8', disposition: /^attachment; filename="transfer.csv"/ },
      // the content decides: a PNG named .csv is a PNG, served with a .png name
      { data: image, name: 'looks-like.csv', type: 'image/png', disposition: /^inline; filename="looks-like.csv.png"/ }
    ]
    for (const f of files) {
      const res = await upload(f.data, f.name)
      expect(res.status, JSON.stringify(res.body)).toBe(201)
      const { res: got, bytes } = await download(res.body.url)
      expect(got.status).toBe(200)
      expect(got.headers.get('content-type')).toBe(f.type)
      expect(got.headers.get('x-content-type-options')).toBe('nosniff')
      expect(got.headers.get('content-disposition')).toMatch(f.disposition)
      expect(bytes.equals(f.data)).toBe(true)
    }
    const listed = (await threads(as.manager, studyId)).find(t => t.id === noteId)!.attachments
    expect(listed.map(a => a.mimeType)).toEqual(['image/png', 'application/pdf', 'text/csv', 'image/png'])
    expect(await db('audit_log').where({ action: 'attachment.added', target_id: String(studyId) }).count({ n: '*' }).first()).toMatchObject({ n: 4 })
  })

  it('refuses a .png holding HTML, a script, binary junk and NUL-bearing text with 415 naming the field', async () => {
    const before = (await db('note_attachments').where({ note_id: noteId }).count({ n: '*' }))[0]!.n
    for (const [data, name] of [
      ['<!doctype html><html><body><script>alert(1)</script></body></html>', 'photo.png'],
      ['<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>', 'chart.csv'],
      ['a,b\n<script>alert(1)</script>,2\n', 'data.csv'],
      [Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0, 0, 0, 8, 0]), 'archive.csv'],
      [Buffer.from('a,b\n1,\u0000\n'), 'nul.csv'],
      ['a,"b\n1,2\n', 'unterminated.csv']
    ] as const) {
      const res = await upload(data as Buffer | string, name)
      expect(res.status, name).toBe(415)
      expect(res.body.message).toMatch(/^file: /)
    }
    expect((await db('note_attachments').where({ note_id: noteId }).count({ n: '*' }))[0]!.n).toBe(before)
  })

  it('refuses a file over 10 MB with 413 before storing anything, and a missing file with 400', async () => {
    const big = Buffer.concat([png(), Buffer.alloc(10 * 1024 * 1024 + 1)])
    const res = await upload(big, 'huge.png')
    expect(res.status).toBe(413)
    expect(res.body.message).toContain('file: must be at most 10 MB')
    const form = new FormData()
    form.append('other', 'x')
    const missing = await api<{ message: string }>(`/api/notes/${noteId}/attachments`, { method: 'POST', cookie: as.engineer, body: form })
    expect(missing.status).toBe(400)
    expect(missing.body.message).toMatch(/^file: /)
  })

  it('lets only the note\'s author or an admin attach, and keeps files to the team', async () => {
    expect((await upload(png(), 'x.png', as.architect)).status).toBe(403)
    expect((await upload(png(), 'x.png', as.manager)).status).toBe(403)
    expect((await upload(png(), 'x.png', as.admin)).status).toBe(201)
    const ok = await upload(png(), 'team-only.png')
    expect((await upload(png(), 'x.png', as.otherTeam)).status).toBe(404)
    expect((await download(ok.body.url, as.otherTeam)).res.status).toBe(404)
    expect((await download(ok.body.url, '')).res.status).toBe(401)
    // a deleted note's files are gone with it
    await api(`/api/notes/${noteId}`, { method: 'DELETE', cookie: as.engineer })
    expect((await download(ok.body.url)).res.status).toBe(404)
  })
})
