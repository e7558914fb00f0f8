import { z } from 'zod'
import { noteCreateSchema, notePatchSchema } from '#shared/schemas/notes'
import { libraryDeleteQuerySchema, presetCreateSchema, presetPatchSchema, templateCreateSchema, templatePatchSchema } from '#shared/schemas/library'
import { portfolioQuerySchema } from '#shared/schemas/portfolio'
import { decisionSchema, reviewRequestSchema, reviewVerdictSchema, statusChangeSchema } from '#shared/schemas/review'
import { rulePackCreateSchema, rulePackDryRunSchema, rulePackPatchSchema } from '#shared/schemas/rulePacks'
import { idParamSchema, signInSchema } from '#shared/schemas/study'
import { invitationAcceptSchema, invitationCreateSchema, invitationTokenSchema, memberUpdateSchema } from '#shared/schemas/team'
import { tokenCreateSchema } from '#shared/schemas/tokens'
import { EVALUATE_EXAMPLE, PROCESS_EXAMPLE, SPEC_EXAMPLE, type ApiOperation } from './types'

const LIBRARY = 'admin or architect'
const LEADS = 'architect or admin'
const json = (description: string, status = 200) => ({ status, description })
const PACK = {
  id: 'team-area-note', name: 'Area noted',
  rules: [{
    id: 'area-any', severity: 'note', title: 'Area noted', explanation: 'Area {metrics.totalAreaMm2|mm2}', action: 'None',
    basis: { handbook: ['§4.6'], metrics: ['totalAreaMm2'] }, threshold: { source: 'common-practice', note: 'example' },
    conditions: { all: [{ fact: 'metrics', path: '$.totalAreaMm2', operator: 'greaterThan', value: 0 }] }
  }]
}

/** Review and decision, notes, the process and spec library, rule packs, the team, tokens and sign-in. */
export const TEAM_OPERATIONS: ApiOperation[] = [
  { route: 'POST /api/auth/login', summary: 'Sign in (sets the session cookie)', tag: 'Sign-in', auth: 'public', body: signInSchema, example: { email: 'engineer@harrowlake.example', password: 'harrow-lake-demo' }, ok: json('the user and a display token that grants nothing') },
  { route: 'POST /api/auth/logout', summary: 'Sign out (revokes the session)', tag: 'Sign-in', auth: 'public', ok: json('signed out') },
  { route: 'GET /api/auth/session', summary: 'Who is calling', tag: 'Sign-in', auth: 'user', ok: json('the user: id, email, name, role, teamId, teamName') },
  { route: 'GET /api/studies/:id/review', summary: 'Reviewers, verdicts and the decision', tag: 'Review', auth: 'user', params: idParamSchema, ok: json('the review state') },
  { route: 'GET /api/studies/:id/activity', summary: 'Everything that happened to the study', tag: 'Review', auth: 'user', params: idParamSchema, ok: json('activity, newest first') },
  { route: 'GET /api/studies/:id/brief', summary: 'The one-page brief (JSON)', tag: 'Review', auth: 'user', params: idParamSchema, ok: json('the brief') },
  { route: 'GET /api/studies/:id/brief.pdf', summary: 'The one-page brief (PDF)', tag: 'Review', auth: 'user', params: idParamSchema, ok: { status: 200, description: 'A4 PDF', type: 'application/pdf' } },
  { route: 'POST /api/studies/:id/review-request', summary: 'Ask architects for review', tag: 'Review', auth: 'user', roles: 'the owner, an architect or an admin', params: idParamSchema, body: reviewRequestSchema, example: { statusVersion: 0, reviewerIds: [2] }, ok: json('the review state') },
  { route: 'POST /api/studies/:id/reviews', summary: 'Sign off or request changes', tag: 'Review', auth: 'user', roles: 'an assigned architect who is not the owner', params: idParamSchema, body: reviewVerdictSchema, example: { statusVersion: 1, verdict: 'signed_off', comment: 'Margins checked' }, ok: json('the verdict', 201) },
  { route: 'POST /api/studies/:id/decision', summary: 'Record the decision', tag: 'Review', auth: 'user', roles: LEADS, params: idParamSchema, body: decisionSchema, example: { statusVersion: 1, candidateId: 'segmented-m4', rationale: 'Smallest that meets every line', revision: 1, signOffIds: [1] }, ok: json('the decision', 201) },
  { route: 'POST /api/studies/:id/reopen', summary: 'Reopen a decided study as a draft', tag: 'Review', auth: 'user', roles: LEADS, params: idParamSchema, body: statusChangeSchema, example: { statusVersion: 2 }, ok: json('the study') },
  { route: 'POST /api/studies/:id/archive', summary: 'Archive a decided study', tag: 'Review', auth: 'user', roles: LEADS, params: idParamSchema, body: statusChangeSchema, example: { statusVersion: 2 }, ok: json('the study') },
  { route: 'GET /api/studies/:id/notes', summary: 'The study\'s note threads', tag: 'Notes', auth: 'user', params: idParamSchema, ok: json('threads') },
  { route: 'POST /api/studies/:id/notes', summary: 'Write a note or a reply', tag: 'Notes', auth: 'user', params: idParamSchema, body: noteCreateSchema, example: { body: 'Check the **switch** resistance' }, ok: json('the note', 201) },
  { route: 'PATCH /api/notes/:id', summary: 'Edit your note', tag: 'Notes', auth: 'user', roles: 'its author or an admin', params: idParamSchema, body: notePatchSchema, example: { version: 1, body: 'Edited' }, ok: json('the note') },
  { route: 'DELETE /api/notes/:id', summary: 'Delete your note', tag: 'Notes', auth: 'user', roles: 'its author or an admin', params: idParamSchema, ok: { status: 204, description: 'deleted' } },
  { route: 'POST /api/notes/:id/resolve', summary: 'Resolve a thread', tag: 'Notes', auth: 'user', params: idParamSchema, body: z.strictObject({}), example: {}, ok: json('the thread') },
  { route: 'POST /api/notes/:id/reopen', summary: 'Reopen a thread', tag: 'Notes', auth: 'user', params: idParamSchema, body: z.strictObject({}), example: {}, ok: json('the thread') },
  { route: 'POST /api/notes/:id/attachments', summary: 'Attach a file to a note (multipart, field "file")', tag: 'Notes', auth: 'user', params: idParamSchema, multipart: true, ok: json('the attachment', 201) },
  { route: 'GET /api/attachments/:id', summary: 'Download an attachment', tag: 'Notes', auth: 'user', params: idParamSchema, ok: { status: 200, description: 'the file', type: 'application/octet-stream' } },
  { route: 'GET /api/presets', summary: 'Process presets', tag: 'Library', auth: 'user', ok: json('presets') },
  { route: 'POST /api/presets', summary: 'Create a process preset', tag: 'Library', auth: 'user', roles: LIBRARY, body: presetCreateSchema, example: { name: 'Poly 1 kΩ/□', description: 'example', process: PROCESS_EXAMPLE }, ok: json('the preset', 201) },
  { route: 'PATCH /api/presets/:id', summary: 'Edit a preset (409 when version is stale)', tag: 'Library', auth: 'user', roles: LIBRARY, params: idParamSchema, body: presetPatchSchema, example: { version: 1, name: 'Poly, edited' }, ok: json('the preset') },
  { route: 'DELETE /api/presets/:id', summary: 'Delete a preset', tag: 'Library', auth: 'user', roles: LIBRARY, params: idParamSchema, query: libraryDeleteQuerySchema, ok: { status: 204, description: 'deleted' } },
  { route: 'GET /api/templates', summary: 'Spec templates', tag: 'Library', auth: 'user', ok: json('templates') },
  { route: 'POST /api/templates', summary: 'Create a spec template', tag: 'Library', auth: 'user', roles: LIBRARY, body: templateCreateSchema, example: { name: '8-bit trim', description: 'example', spec: SPEC_EXAMPLE }, ok: json('the template', 201) },
  { route: 'PATCH /api/templates/:id', summary: 'Edit a template (409 when version is stale)', tag: 'Library', auth: 'user', roles: LIBRARY, params: idParamSchema, body: templatePatchSchema, example: { version: 1, name: '8-bit trim, edited' }, ok: json('the template') },
  { route: 'DELETE /api/templates/:id', summary: 'Delete a template', tag: 'Library', auth: 'user', roles: LIBRARY, params: idParamSchema, query: libraryDeleteQuerySchema, ok: { status: 204, description: 'deleted' } },
  { route: 'GET /api/rule-packs', summary: 'Built-in and team rule packs', tag: 'Rule packs', auth: 'user', ok: json('packs') },
  { route: 'POST /api/rule-packs', summary: 'Add a team rule pack', tag: 'Rule packs', auth: 'user', roles: 'admin', body: rulePackCreateSchema, example: { pack: PACK, enabled: false }, ok: json('the pack', 201) },
  { route: 'GET /api/rule-packs/:id', summary: 'One team rule pack', tag: 'Rule packs', auth: 'user', params: idParamSchema, ok: json('the pack') },
  { route: 'GET /api/rule-packs/:id/history', summary: 'A pack\'s versions', tag: 'Rule packs', auth: 'user', params: idParamSchema, ok: json('versions') },
  { route: 'PATCH /api/rule-packs/:id', summary: 'Edit or enable a pack', tag: 'Rule packs', auth: 'user', roles: 'admin', params: idParamSchema, body: rulePackPatchSchema, example: { version: 1, enabled: true }, ok: json('the pack') },
  { route: 'POST /api/rule-packs/:id/dry-run', summary: 'Run a stored pack on an input', tag: 'Rule packs', auth: 'user', roles: 'admin', params: idParamSchema, body: rulePackDryRunSchema, example: { input: EVALUATE_EXAMPLE }, ok: json('the findings') },
  { route: 'POST /api/rule-packs/dry-run', summary: 'Run a draft pack on an input', tag: 'Rule packs', auth: 'user', roles: 'admin', body: rulePackDryRunSchema, example: { pack: PACK, input: EVALUATE_EXAMPLE }, ok: json('the findings') },
  { route: 'GET /api/portfolio', summary: 'Every study\'s state and chosen option', tag: 'Portfolio', auth: 'user', query: portfolioQuerySchema, ok: json('a page of the portfolio') },
  { route: 'GET /api/portfolio/export', summary: 'The portfolio as CSV', tag: 'Portfolio', auth: 'user', query: portfolioQuerySchema, ok: { status: 200, description: 'CSV', type: 'text/csv' } },
  { route: 'GET /api/team', summary: 'Members (and open invitations for admins)', tag: 'Team', auth: 'user', ok: json('the team') },
  { route: 'POST /api/team/invitations', summary: 'Invite someone by e-mail', tag: 'Team', auth: 'user', roles: 'admin', body: invitationCreateSchema, example: { email: 'new.colleague@example.com', name: 'New Colleague', role: 'engineer' }, ok: json('the invitation', 201) },
  { route: 'PATCH /api/team/members/:id', summary: 'Change a member\'s role or access', tag: 'Team', auth: 'user', roles: 'admin', params: idParamSchema, body: memberUpdateSchema, example: { role: 'architect' }, ok: json('the member') },
  { route: 'GET /api/invitations/:token', summary: 'What an invitation link offers', tag: 'Team', auth: 'public', params: invitationTokenSchema, ok: json('the invitation') },
  { route: 'POST /api/invitations/:token/accept', summary: 'Accept an invitation and set a password', tag: 'Team', auth: 'public', params: invitationTokenSchema, body: invitationAcceptSchema, example: { password: 'a-long-enough-password' }, ok: json('signed in', 201) },
  { route: 'GET /api/admin/mail', summary: 'Mail the local catcher caught (development)', tag: 'Team', auth: 'user', roles: 'admin', ok: json('caught mail') },
  { route: 'GET /api/tokens', summary: 'Your API tokens (never the tokens themselves)', tag: 'API tokens', auth: 'session', ok: json('your tokens') },
  { route: 'POST /api/tokens', summary: 'Create an API token (shown once)', tag: 'API tokens', auth: 'session', body: tokenCreateSchema, example: { name: 'Nightly regression', scopes: ['read', 'evaluate'], expiresInDays: 90 }, ok: json('the token, with `token` this once', 201) },
  { route: 'DELETE /api/tokens/:id', summary: 'Revoke one of your tokens', tag: 'API tokens', auth: 'session', params: idParamSchema, ok: json('the revoked token') },
  { route: 'GET /api/openapi.json', summary: 'This description', tag: 'Health', auth: 'public', ok: json('OpenAPI 3.1') }
]
