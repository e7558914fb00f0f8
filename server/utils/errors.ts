import type { H3Event, EventHandlerRequest } from 'h3'
import type { z } from 'zod'

export const MESSAGES = {
  databaseUnavailable: 'The database is unavailable; try again in a moment',
  invalidInput: 'Invalid input',
  signInFailed: 'Email or password is incorrect',
  signInRateLimited: 'Too many failed sign-ins; wait a few minutes and try again',
  notSignedIn: 'Sign in first',
  forbidden: 'Your role does not allow this',
  notFound: 'Not found',
  internal: 'Something went wrong on our side'
} as const

/** One issue per field, as the API's 400 responses carry them in `data.issues`. */
export interface FieldIssue { path: string, message: string }

/** Turns zod issues into field-named messages, e.g. "spec.bits: must be an integer from 2 to 16". */
export function formatZodIssues(error: z.ZodError): { message: string, issues: FieldIssue[] } {
  const issues = error.issues.map(i => ({ path: i.path.map(String).join('.') || '(body)', message: i.message }))
  return { message: issues.map(i => `${i.path}: ${i.message}`).join('; '), issues }
}

/** Maps any thrown value to an h3 error: h3 errors pass, database outages → 503, the rest → 500. */
export function toHttpError(error: unknown) {
  if (isError(error)) {
    const cause = (error as { cause?: unknown }).cause
    if (error.statusCode >= 500 && isDatabaseUnavailable(cause)) return unavailable()
    return error
  }
  if (isDatabaseUnavailable(error)) return unavailable()
  console.error('[rungwise] unhandled error', error)
  return createError({ statusCode: 500, statusMessage: MESSAGES.internal })
}

function unavailable() {
  return createError({ statusCode: 503, statusMessage: MESSAGES.databaseUnavailable, data: { message: MESSAGES.databaseUnavailable } })
}

/** A 400 whose message names each invalid field and its allowed range. */
export function badRequest(error: z.ZodError) {
  const formatted = formatZodIssues(error)
  return createError({ statusCode: 400, statusMessage: MESSAGES.invalidInput, message: formatted.message, data: formatted })
}

/** defineEventHandler with the one error mapper around it. */
export function defineApiHandler<T>(handler: (event: H3Event<EventHandlerRequest>) => Promise<T> | T) {
  return defineEventHandler(async (event) => {
    try {
      return await handler(event)
    } catch (error) {
      throw toHttpError(error)
    }
  })
}
