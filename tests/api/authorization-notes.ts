import type { Fixtures, MatrixRow } from './authorization-table'

/** Matrix rows for notes and their attachments. Every role annotates; only the author or an admin edits. */
async function demo(f: Fixtures) {
  const team = await f.db('teams').where({ slug: 'harrow-lake' }).first('id')
  const engineer = await f.db('users').where({ email: 'engineer@harrowlake.example' }).first('id')
  return { teamId: team.id as number, engineerId: engineer.id as number }
}

/** A fresh note by the demo engineer on the demo team's study, at version 1 (resolved when asked). */
async function engineerNote(f: Fixtures, resolved = false): Promise<number> {
  const { teamId, engineerId } = await demo(f)
  const [id] = await f.db('notes').insert({
    team_id: teamId, study_id: f.ownStudyId, anchor_type: 'study', revision: 0, body: 'Matrix note', body_html: '<p>Matrix note</p>',
    author_id: engineerId, resolved_at: resolved ? new Date() : null, resolved_by: resolved ? engineerId : null
  })
  return id!
}

async function engineerAttachment(f: Fixtures): Promise<number> {
  const { teamId, engineerId } = await demo(f)
  const noteId = await engineerNote(f)
  const data = Buffer.from('code,volts\n0,0\n')
  const [id] = await f.db('note_attachments').insert({ team_id: teamId, note_id: noteId, filename: 'matrix.csv', mime_type: 'text/csv', size_bytes: data.length, sha256: '0'.repeat(64), data, uploaded_by: engineerId })
  return id!
}

function csvForm(): FormData {
  const form = new FormData()
  form.append('file', new Blob(['code,volts\n0,0\n1,0.5\n'], { type: 'text/csv' }), 'matrix.csv')
  return form
}

const TEAM = { signedOut: 401, admin: 200, architect: 200, engineer: 200, manager: 200, otherTeam: 404 }
// another team's members get 404 (the note is not theirs to see) before any author check
const AUTHOR_OR_ADMIN = { signedOut: 401, admin: 200, architect: 403, engineer: 200, manager: 403, otherTeam: 404, otherArchitect: 404, otherManager: 404 }

export const NOTE_ROWS: MatrixRow[] = [
  { route: 'GET /api/studies/:id/notes', expect: TEAM, request: f => ({ path: `/api/studies/${f.ownStudyId}/notes` }) },
  {
    route: 'POST /api/studies/:id/notes',
    expect: { signedOut: 401, admin: 201, architect: 201, engineer: 201, manager: 201, otherTeam: 404 },
    request: (f, who) => ({ path: `/api/studies/${f.ownStudyId}/notes`, body: { body: `Matrix note by ${who}` } })
  },
  { route: 'PATCH /api/notes/:id', expect: AUTHOR_OR_ADMIN, request: async f => ({ path: `/api/notes/${await engineerNote(f)}`, body: { version: 1, body: 'Edited in the matrix' } }) },
  {
    route: 'DELETE /api/notes/:id',
    expect: { signedOut: 401, admin: 204, architect: 403, engineer: 204, manager: 403, otherTeam: 404, otherArchitect: 404, otherManager: 404 },
    request: async f => ({ path: `/api/notes/${await engineerNote(f)}` })
  },
  { route: 'POST /api/notes/:id/resolve', expect: TEAM, request: async f => ({ path: `/api/notes/${await engineerNote(f)}/resolve` }) },
  { route: 'POST /api/notes/:id/reopen', expect: TEAM, request: async f => ({ path: `/api/notes/${await engineerNote(f, true)}/reopen` }) },
  {
    route: 'POST /api/notes/:id/attachments',
    expect: { signedOut: 401, admin: 201, architect: 403, engineer: 201, manager: 403, otherTeam: 404, otherArchitect: 404, otherManager: 404 },
    request: async f => ({ path: `/api/notes/${await engineerNote(f)}/attachments`, body: csvForm() })
  },
  { route: 'GET /api/attachments/:id', expect: TEAM, request: async f => ({ path: `/api/attachments/${await engineerAttachment(f)}` }) }
]
