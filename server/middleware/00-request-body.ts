import type { IncomingMessage } from 'node:http'

/** Largest JSON body and largest multipart upload (a note attachment is at most 10 MB). */
export const BODY_LIMITS = { json: 8_000_000, upload: 12_000_000 }
/** Beyond the limit the rest is read and dropped up to this much more, so the client gets its 413; then the connection is cut. */
const DRAIN_BYTES = 64_000_000

const JSON_TYPE = /^application\/(?:[\w.+-]+\+)?json\b/i
const UPLOAD_TYPE = /^multipart\/form-data\b/i

function refuse(statusCode: number, message: string) {
  return createError({ statusCode, statusMessage: statusCode === 413 ? 'Request body too large' : 'Unsupported body type', message, data: { message } })
}

/** Reads the body counting bytes as they arrive; rejects with 413 as soon as the count passes `limit`. */
function readLimited(req: IncomingMessage, limit: number): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    let bytes = 0
    let over = false
    req.on('data', (chunk: Buffer) => {
      bytes += chunk.length
      if (over) {
        if (bytes > limit + DRAIN_BYTES) req.destroy()
        return
      }
      if (bytes > limit) {
        over = true
        chunks.length = 0
        reject(refuse(413, `(input): the request body is larger than ${limit / 1e6} MB`))
        return
      }
      chunks.push(chunk)
    })
    req.on('end', () => {
      if (!over) resolve(Buffer.concat(chunks))
    })
    req.on('error', reject)
  })
}

/**
 * Every API request with a body, signed in or not, before any route reads it: a JSON body (or a
 * multipart upload) only, 415 for anything else (a form-encoded or text body is what a cross-site
 * form can send without asking); 413 when the declared length or, for a chunked body, the bytes
 * counted while it streams pass the limit; nothing beyond the limit is kept in memory. The body
 * read here is what the routes' readBody then parses.
 */
export default defineEventHandler(async (event) => {
  if (!event.path.startsWith('/api/') || !['POST', 'PUT', 'PATCH', 'DELETE'].includes(event.method)) return
  const req = event.node.req
  const declared = Number.parseInt(req.headers['content-length'] ?? '', 10)
  const chunked = /\bchunked\b/i.test(String(req.headers['transfer-encoding'] ?? ''))
  if (!(declared > 0) && !chunked) return
  const type = req.headers['content-type'] ?? ''
  const upload = UPLOAD_TYPE.test(type)
  if (!upload && !JSON_TYPE.test(type)) {
    throw refuse(415, `(input): send the body as application/json${type ? `, not ${type.split(';')[0]}` : ''}`)
  }
  const limit = upload ? BODY_LIMITS.upload : BODY_LIMITS.json
  if (declared > limit) throw refuse(413, `(input): the request body is larger than ${limit / 1e6} MB`)
  const body = await readLimited(req, limit)
  // where h3's readRawBody (and so readBody, readMultipartFormData) finds a body already read
  ;(req as unknown as Record<symbol, Promise<Buffer>>)[Symbol.for('h3RawBody')] = Promise.resolve(body)
})
