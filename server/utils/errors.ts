import type { H3Event, EventHandlerRequest } from 'h3'
import type { z } from 'zod'
import { formatIssues } from '#shared/core/contract/errors'

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

/** A 400 whose message names each invalid field and its allowed range (the CLI prints the same). */
export function badRequest(error: z.ZodError) {
  const formatted = formatIssues(error)
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
