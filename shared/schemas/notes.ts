import { z } from 'zod'
import { REQUIRED_METRICS } from '../core/contract/evaluate-output'
import { says } from '../core/contract/fields'
import { versionField } from './library'

/**
 * Bodies of the notes routes (`/api/studies/:id/notes`, `/api/notes/:id`). A note is anchored to
 * the study, to one candidate, or to one metric of a candidate; a reply names its thread.
 */
export const NOTE_BODY_MAX = 10_000
const BODY_RULE = `must be text of 1 to ${NOTE_BODY_MAX} characters`
const body = z.string(says(BODY_RULE)).trim().min(1, says(BODY_RULE)).max(NOTE_BODY_MAX, says(BODY_RULE))
const CANDIDATE_RULE = 'must be a candidate id of 1 to 60 letters, digits, dots, dashes or underscores'
const candidateId = z.string(says(CANDIDATE_RULE)).regex(/^[\w.-]{1,60}$/, says(CANDIDATE_RULE))
/** Metrics a note may discuss: the contract's fixed metric names. */
export const NOTE_METRICS = REQUIRED_METRICS
const METRIC_RULE = `must be one of the metric names (${NOTE_METRICS.join(', ')})`
const metricKey = z.enum(NOTE_METRICS, says(METRIC_RULE))

export const noteAnchorSchema = z.discriminatedUnion('type', [
  z.strictObject({ type: z.literal('study') }),
  z.strictObject({ type: z.literal('candidate'), candidateId }),
  z.strictObject({ type: z.literal('metric'), candidateId, metricKey })
], says('must be {type: "study"}, {type: "candidate", candidateId} or {type: "metric", candidateId, metricKey}'))

const parentId = z.number(says('must be the id of the note you reply to')).int(says('must be the id of the note you reply to')).min(1, says('must be the id of the note you reply to'))

export const noteCreateSchema = z.strictObject({
  body,
  /** for a new thread; a reply takes its thread's anchor */
  anchor: noteAnchorSchema.optional(),
  parentId: parentId.optional()
})

export const notePatchSchema = z.strictObject({ version: versionField, body })

export type NoteAnchor = z.infer<typeof noteAnchorSchema>
export type NoteCreate = z.infer<typeof noteCreateSchema>
export type NotePatch = z.infer<typeof notePatchSchema>
