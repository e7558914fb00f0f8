/**
 * Every API answer is private to the session that asked (JSON, CSV, netlists, PDFs, attachments):
 * `Cache-Control: no-store`, so no shared cache or browser disk keeps a copy after sign-out.
 */
export default defineEventHandler((event) => {
  if (event.path.startsWith('/api/')) setResponseHeader(event, 'cache-control', 'no-store')
})
