import { inflateSync } from 'node:zlib'
import type { Knex } from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { testDb } from '../support/db'
import { api, DEMO, signIn } from '../support/http'
import { evaluate, post, studyWithResults, type Evaluated } from './review-support'

let db: Knex
let engineer: string
let architect: string
let manager: string
let ev: Evaluated
const title = `Brief check ${Date.now()}`

beforeAll(async () => {
  db = testDb()
  ;[engineer, architect, manager] = await Promise.all([signIn(DEMO.engineer), signIn(DEMO.architect), signIn(DEMO.manager)])
  ev = await evaluate(db, engineer)
}, 120_000)
afterAll(async () => {
  await db.destroy()
})

async function pdfOf(id: number, cookie: string) {
  const res = await fetch(`${(await import('vitest')).inject('baseUrl')}/api/studies/${id}/brief.pdf`, { headers: { cookie } })
  return { status: res.status, headers: res.headers, bytes: Buffer.from(await res.arrayBuffer()) }
}

describe('brief', () => {
  it('says what was asked, what was chosen and why, and who signed off; the PDF is one A4 page with the title', async () => {
    const id = await studyWithResults(engineer, ev, title)
    const architectId = (await db('users').where({ email: DEMO.architect }).first('id')).id
    await post(id, 'review-request', engineer, { statusVersion: 0, reviewerIds: [architectId] })
    const s = await post(id, 'reviews', architect, { statusVersion: 1, verdict: 'signed_off', comment: 'Fine by me.' })
    const candidateId = ev.recommendedId ?? ev.candidateIds[0]!
    expect((await post(id, 'decision', architect, { statusVersion: 2, candidateId, rationale: 'Meets every target with the least area.', revision: 1, signOffIds: [s.body.entries.find(e => e.kind === 'signed_off')!.id] })).status).toBe(201)

    const brief = await api<{ asked: string[], decision: { candidateId: string, rationale: string }, signOffs: { name: string, comment: string }[], caution: string, subject: { lines: { label: string }[] } }>(`/api/studies/${id}/brief`, { cookie: manager })
    expect(brief.status).toBe(200)
    // The spec in words: 8 bits, 2.5 V, 1e6 updates per second, 10 pF (the SPEC of review-support.ts).
    expect(brief.body.asked[0]).toBe('An 8-bit DAC from a 2.5 V reference, updating at 1 MHz into 10 pF.')
    expect(brief.body.decision).toMatchObject({ candidateId, rationale: 'Meets every target with the least area.' })
    expect(brief.body.signOffs).toEqual([expect.objectContaining({ comment: 'Fine by me.' })])
    expect(brief.body.subject.lines.map(l => l.label)).toEqual(['Area', 'Yield', 'Worst glitch', 'Reference power'])
    expect(brief.body.caution).toContain('first-order')

    const pdf = await pdfOf(id, manager)
    expect(pdf.status).toBe(200)
    expect(pdf.headers.get('content-type')).toBe('application/pdf')
    expect(pdf.headers.get('content-disposition')).toMatch(new RegExp(`^attachment; filename="rungwise-brief-${id}-Brief-check-\\d+\\.pdf"$`))
    const text = pdf.bytes.toString('latin1')
    expect(text.startsWith('%PDF-')).toBe(true)
    expect(text.trimEnd().endsWith('%%EOF')).toBe(true)
    // PDF 1.7 (ISO 32000-1) §7.7.3: one page object (/Type /Page) and a page tree counting one.
    expect(text.match(/\/Type \/Page\b/g)).toHaveLength(1)
    expect(text).toMatch(/\/Count 1\b/)
    // A4 is 595.28 × 841.89 pt (ISO 216, 210 × 297 mm at 72 pt per inch).
    expect(text).toMatch(/\/MediaBox \[0 0 595\.28 841\.89\]/)
    // The document information's Title (§14.3.3) is an indirect string object naming the study.
    const titleRef = /\/Title (\d+) 0 R/.exec(text)![1]
    const titleObj = text.slice(text.indexOf(`\n${titleRef} 0 obj`), text.indexOf('endobj', text.indexOf(`\n${titleRef} 0 obj`)))
    expect(titleObj).toContain(`(Brief: ${title})`)
    expect(text).toMatch(/\/FontName \/[A-Z]{6}\+Lexend/)
    // Every content stream inflates (zlib, RFC 1950), so the file is not truncated.
    const streams = [...text.matchAll(/\/Filter \/FlateDecode[^>]*>>\s*stream\r?\n/g)]
    expect(streams.length).toBeGreaterThan(0)
    const first = streams[0]!
    const start = first.index! + first[0].length
    expect(() => inflateSync(pdf.bytes.subarray(start, text.indexOf('endstream', start)))).not.toThrow()
  })

  it('lets every role of the team read and export the brief, and hides it from other teams', async () => {
    const id = await studyWithResults(engineer, ev, `${title} roles`)
    for (const cookie of [engineer, architect, manager, await signIn(DEMO.admin)]) expect((await pdfOf(id, cookie)).status).toBe(200)
    expect((await pdfOf(id, '')).status).toBe(401)
    expect((await api(`/api/studies/${id + 100000}/brief`, { cookie: manager })).status).toBe(404)
  })
})
