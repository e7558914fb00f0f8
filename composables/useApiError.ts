/** The message a person should read for a failed API call (field messages for 400s). */
export function apiErrorMessage(error: unknown): string {
  const e = error as { statusCode?: number, data?: { message?: string, statusMessage?: string, data?: { message?: string } }, statusMessage?: string, message?: string } | null
  if (!e) return 'Unknown error'
  const detail = e.data?.data?.message ?? e.data?.message ?? e.data?.statusMessage ?? e.statusMessage ?? e.message
  if (e.statusCode === 503) return 'The database is unavailable; try again in a moment.'
  return detail ?? 'Request failed'
}

/** Field → message map from a 400 response's `data.issues`. */
export function apiFieldErrors(error: unknown): Record<string, string> {
  const issues = (error as { data?: { data?: { issues?: { path: string, message: string }[] } } } | null)?.data?.data?.issues ?? []
  return Object.fromEntries(issues.map(i => [i.path, i.message]))
}
