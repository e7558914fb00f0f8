import { fileTypeFromBuffer } from 'file-type'
import { parse } from 'csv-parse/sync'

/** Largest file a note takes (10 MiB). */
export const ATTACHMENT_MAX_BYTES = 10 * 1024 * 1024
/** Room for the multipart framing around one file, when judging Content-Length before reading. */
export const MULTIPART_OVERHEAD_BYTES = 64 * 1024

/** What a note accepts, by the type its content shows; the extension we serve it with. */
export const ATTACHMENT_TYPES = {
  'image/png': 'png',
  'image/jpeg': 'jpg',
  'image/gif': 'gif',
  'image/webp': 'webp',
  'application/pdf': 'pdf',
  'text/csv': 'csv'
} as const
export type AttachmentType = keyof typeof ATTACHMENT_TYPES
const ALLOWED_WORDS = 'PNG, JPEG, GIF or WebP image, PDF, or CSV'

/** Images are shown in place; everything else is only ever downloaded. */
export const INLINE_TYPES: readonly AttachmentType[] = ['image/png', 'image/jpeg', 'image/gif', 'image/webp']

export function attachmentError(statusCode: 400 | 413 | 415, rule: string) {
  const message = `file: ${rule}`
  const statusMessage = statusCode === 413 ? 'File too large' : statusCode === 415 ? 'Unsupported file type' : MESSAGES.invalidInput
  return createError({ statusCode, statusMessage, message, data: { message, issues: [{ path: 'file', message: rule }] } })
}

/** Markup a browser would run or render: never accepted as text (common practice, no source). */
const MARKUP = /<\s*(!doctype|html|head|body|script|iframe|object|embed|svg|math|style|link|meta|img|form|input|frame|base|\?xml)\b|javascript:/i

function csvText(data: Buffer): boolean {
  if (data.includes(0)) return false
  let text: string
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(data)
  } catch {
    return false
  }
  if (!text.trim() || MARKUP.test(text)) return false
  try {
    const rows = parse(text.replace(/^\uFEFF/, ''), { bom: true, skip_empty_lines: true }) as string[][]
    return rows.length > 0
  } catch {
    return false
  }
}

/**
 * The file's type from its bytes, never from its name: file-type reads the magic numbers of
 * images and PDF; CSV has none, so it is CSV only when it is UTF-8 text without NUL bytes and
 * markup and csv-parse reads it (equal column counts). Anything else is a 415 naming the field.
 */
export async function sniffAttachment(data: Buffer): Promise<AttachmentType> {
  const found = await fileTypeFromBuffer(data)
  if (found) {
    if (found.mime in ATTACHMENT_TYPES && found.mime !== 'text/csv') return found.mime as AttachmentType
    throw attachmentError(415, `its content is ${found.mime}; a note takes a ${ALLOWED_WORDS}`)
  }
  if (csvText(data)) return 'text/csv'
  const looksLikeMarkup = MARKUP.test(data.subarray(0, 4096).toString('latin1'))
  throw attachmentError(415, looksLikeMarkup
    ? `its content is HTML or script, whatever its name says; a note takes a ${ALLOWED_WORDS}`
    : `its content is not a ${ALLOWED_WORDS}`)
}

/** A name safe for a header and a file system, ending in the extension of the sniffed type. */
export function safeFilename(name: string | undefined, type: AttachmentType): string {
  const ext = ATTACHMENT_TYPES[type]
  const base = (name ?? '').normalize('NFC').replace(/[^\p{L}\p{N}._ -]+/gu, '_').replace(/^[.\s]+/, '').slice(0, 150).trim() || 'attachment'
  const exts = type === 'image/jpeg' ? ['jpg', 'jpeg'] : [ext]
  const current = base.split('.').pop()?.toLowerCase() ?? ''
  return base.includes('.') && exts.includes(current) ? base : `${base}.${ext}`
}

/** Content-Disposition with an ASCII fallback and the UTF-8 name (RFC 6266 / RFC 5987). */
export function contentDisposition(kind: 'inline' | 'attachment', filename: string): string {
  const ascii = filename.replace(/[^\x20-\x7E]/g, '_').replace(/["\\]/g, '_')
  return `${kind}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(filename)}`
}
