/** Notes as the API returns them (`GET /api/studies/:id/notes`). */
export interface NoteAnchorDto {
  type: 'study' | 'candidate' | 'metric'
  candidateId: string | null
  metricKey: string | null
}

export interface NoteAttachmentDto {
  id: number
  filename: string
  mimeType: string
  sizeBytes: number
  url: string
  createdAt: string
}

export interface NoteDto {
  id: number
  studyId: number
  parentId: number | null
  anchor: NoteAnchorDto
  /** the study revision the note was written against */
  revision: number
  /** the metric's value in that revision (metric notes only) */
  valueThen: number | null
  /** the metric's value in the current head revision, when it differs from `valueThen` */
  valueNow: number | null
  /** true when the discussed number differs in the current revision ("number changed since") */
  changed: boolean
  /** the Markdown source (empty for a deleted note) */
  body: string
  /** the sanitised HTML rendering of the source */
  bodyHtml: string
  author: { id: number, name: string }
  mentions: { id: number, name: string }[]
  version: number
  resolved: { at: string, by: string | null } | null
  /** a deleted first note of a thread stays as a placeholder while replies remain */
  deleted: boolean
  attachments: NoteAttachmentDto[]
  createdAt: string
  updatedAt: string
}

/** A thread: its first note and the replies, oldest first. */
export interface NoteThreadDto extends NoteDto { replies: NoteDto[] }
