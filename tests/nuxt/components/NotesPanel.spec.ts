import { mockNuxtImport, mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { readBody } from 'h3'
import { describe, expect, it, vi } from 'vitest'
import NotesMarker from '../../../components/notes/NotesMarker.vue'
import NotesPanel from '../../../components/notes/NotesPanel.vue'
import type { NoteDto, NoteThreadDto } from '../../../shared/types/notes'

const ME = { id: 3, email: 'engineer@harrowlake.example', name: 'Priya Okafor', role: 'engineer', teamId: 1, teamName: 'Harrow Lake Instruments' }
mockNuxtImport('useAuth', () => () => ({ data: ref(ME), status: ref('authenticated'), getSession: async () => ME }))

/** Notes in the API's shape, invented for the test. */
function note(id: number, over: Partial<NoteDto> = {}): NoteDto {
  return {
    id, studyId: 1, parentId: null, anchor: { type: 'study', candidateId: null, metricKey: null }, revision: 2, valueThen: null, valueNow: null, changed: false,
    body: `note ${id}`, bodyHtml: `<p>note ${id}</p>\n`, author: { id: 2, name: 'Tomas Reyne' }, mentions: [], version: 1, resolved: null, deleted: false,
    attachments: [], createdAt: '2026-12-01T10:00:00.000Z', updatedAt: '2026-12-01T10:00:00.000Z', ...over
  }
}
const THREADS: NoteThreadDto[] = [
  { ...note(1, { bodyHtml: '<p>Why is <strong>segmented-4</strong> ahead?</p>' }), replies: [note(2, { parentId: 1, author: { id: 3, name: 'Priya Okafor' }, body: 'mine', bodyHtml: '<p>mine</p>' })] },
  { ...note(3, { anchor: { type: 'metric', candidateId: 'string', metricKey: 'inlSigmaLsb' }, revision: 1, valueThen: 0.25, valueNow: 0.31, changed: true }), replies: [] },
  { ...note(4, { body: 'settled', bodyHtml: '<p>settled</p>', resolved: { at: '2026-12-01T11:00:00.000Z', by: 'Dana Whitcombe' } }), replies: [] }
]
const posted: unknown[] = []
registerEndpoint('/api/studies/1/notes', { method: 'GET', handler: () => THREADS })
registerEndpoint('/api/studies/1/notes', {
  method: 'POST',
  handler: async (event) => {
    posted.push(await readBody(event))
    return note(9)
  }
})
registerEndpoint('/api/team', {
  method: 'GET',
  handler: () => ({
    members: [
      { id: 2, name: 'Tomas Reyne', email: 'architect@harrowlake.example', role: 'architect', active: true },
      { id: 3, name: 'Priya Okafor', email: 'engineer@harrowlake.example', role: 'engineer', active: true },
      { id: 4, name: 'Dana Whitcombe', email: 'manager@harrowlake.example', role: 'manager', active: true }
    ],
    invitations: []
  })
})

async function mountPanel() {
  const w = await mountSuspended(NotesPanel, { props: { studyId: 1 } })
  await vi.waitFor(() => expect(w.find('[data-testid="notes-list"]').exists()).toBe(true))
  return w
}

describe('NotesPanel', () => {
  it('shows the open threads with their replies, marks a changed number, and keeps resolved ones behind the filter', async () => {
    const w = await mountPanel()
    expect(w.findAll('[data-thread]').map(t => t.attributes('data-thread'))).toEqual(['1', '3'])
    expect(w.get('[data-thread="1"] [data-testid="note-body"]').html()).toContain('<strong>segmented-4</strong>')
    expect(w.get('[data-thread="1"]').text()).toContain('mine')
    // formatted with the metric's unit, as the comparison writes it
    expect(w.get('[data-thread="3"] [data-testid="note-changed"]').text()).toBe('▲ Number changed since: 0.25 LSB then, 0.31 LSB now')
    expect(w.get('[data-thread="3"]').text()).toContain('on INL σ of string · revision 1')
    expect(w.get('[data-testid="notes-open-count"]').text()).toContain('2 open')
    await w.get('input[type="radio"][value="resolved"]').setValue(true)
    expect(w.findAll('[data-thread]').map(t => t.attributes('data-thread'))).toEqual(['4'])
    expect(w.text()).toContain('✓ Resolved by Dana Whitcombe')
  })

  it('offers edit and delete only on the signed-in member\'s own notes', async () => {
    const w = await mountPanel()
    expect(w.find('[data-note="1"] button[aria-label^="Edit"]').exists()).toBe(false)
    expect(w.find('[data-note="2"] button[aria-label^="Edit"]').exists()).toBe(true)
    expect(w.find('[data-note="2"] button[aria-label^="Delete"]').exists()).toBe(true)
  })

  it('suggests team members after @, inserts the handle, and posts the note with the anchor a marker chose', async () => {
    const w = await mountPanel()
    const marker = await mountSuspended(NotesMarker, { props: { candidateId: 'string', metricKey: 'inlSigmaLsb', label: 'INL σ of string' } })
    // one open note on that metric already: the marker says so
    expect(marker.get('button').attributes('aria-label')).toBe('1 open note on INL σ of string')
    await marker.get('button').trigger('click')
    const box = w.get('[data-testid="study-notes"] > div > form textarea')
    const el = box.element as HTMLTextAreaElement
    el.value = 'Looks wide, @arc'
    el.setSelectionRange(el.value.length, el.value.length)
    await box.trigger('input')
    const options = w.findAll('[role="option"]')
    expect(options.map(o => o.text())).toEqual(['Tomas Reyne @architect · architect'])
    expect(box.attributes('aria-expanded')).toBe('true')
    await box.trigger('keydown', { key: 'Enter' })
    expect(el.value).toBe('Looks wide, @architect ')
    expect(w.get('[data-testid="study-notes"] label.rw-label[for$="-text"]').text()).toBe('New note on INL σ of string')
    await w.get('[data-testid="study-notes"] > div > form').trigger('submit')
    await vi.waitFor(() => expect(posted).toHaveLength(1))
    expect(posted[0]).toEqual({ body: 'Looks wide, @architect ', anchor: { type: 'metric', candidateId: 'string', metricKey: 'inlSigmaLsb' } })
  })
})
