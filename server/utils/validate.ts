import type { H3Event } from 'h3'
import type { z } from 'zod'

/** Reads the JSON body and validates it; a 400 naming each bad field, never a 500. */
export async function readBodyAs<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.infer<S>> {
  let body: unknown
  try {
    body = await readBody(event)
  } catch {
    throw createError({ statusCode: 400, statusMessage: MESSAGES.invalidInput, message: '(input): must be valid JSON', data: { message: '(input): must be valid JSON', issues: [{ path: '(input)', message: 'must be valid JSON' }] } })
  }
  return parseOr400(schema, body)
}

/** Validates the query string. */
export function queryAs<S extends z.ZodType>(event: H3Event, schema: S): z.infer<S> {
  return parseOr400(schema, getQuery(event))
}

/** Validates the route parameters. */
export function paramsAs<S extends z.ZodType>(event: H3Event, schema: S): z.infer<S> {
  return parseOr400(schema, getRouterParams(event))
}

function parseOr400<S extends z.ZodType>(schema: S, value: unknown): z.infer<S> {
  const result = schema.safeParse(value)
  if (!result.success) throw badRequest(result.error)
  return result.data
}
