import { findField, type FieldSection } from '#shared/schemas/fields'

type Issue = { path: string, message: string }

/**
 * The API names the refused field first ("text: …", "spec.bits: must be …") so scripts can tell
 * which field; a person reads the field's label instead (or nothing, for a whole-file field).
 */
function withoutPath(detail: string, issues: Issue[] | undefined): string {
  const path = issues?.[0]?.path
  if (!path || !detail.startsWith(`${path}: `)) return detail
  const rest = detail.slice(path.length + 2)
  const [section, key] = path.split('.')
  const def = key && ['spec', 'process', 'options'].includes(section!) ? findField(section as FieldSection, key) : undefined
  return def ? `${def.label} ${rest}` : rest
}

/** The message a person should read for a failed API call (field messages for 400s, the path replaced by its label). */
export function apiErrorMessage(error: unknown): string {
  const e = error as { statusCode?: number, data?: { message?: string, statusMessage?: string, data?: { message?: string, issues?: Issue[] } }, statusMessage?: string, message?: string } | null
  if (!e) return 'Unknown error'
  const detail = e.data?.data?.message ?? e.data?.message ?? e.data?.statusMessage ?? e.statusMessage ?? e.message
  if (e.statusCode === 503) return 'The database is unavailable; try again in a moment.'
  return detail ? withoutPath(detail, e.data?.data?.issues) : 'Request failed'
}

/** Field → message map from a 400 response's `data.issues`. */
export function apiFieldErrors(error: unknown): Record<string, string> {
  const issues = (error as { data?: { data?: { issues?: { path: string, message: string }[] } } } | null)?.data?.data?.issues ?? []
  return Object.fromEntries(issues.map(i => [i.path, i.message]))
}
