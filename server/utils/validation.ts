import type { H3Event } from 'h3'
import type { z } from 'zod'
import { fieldErrors, type FieldMessages } from '#shared/utils/errors'

const reasons: Record<number, string> = {
  400: 'Invalid input',
  401: 'Unauthorized',
  403: 'Forbidden',
  404: 'Not found',
  409: 'Conflict',
  410: 'Gone',
  413: 'Payload too large',
  429: 'Too many requests',
  503: 'Service unavailable',
}

/**
 * The one way a route refuses a request. Every 4xx/503 has the same body:
 * `{ statusCode, statusMessage, message, data: { message, fields, ...extra } }`, where `fields` maps a
 * dotted input path (or `_` for the request as a whole) to a message for that field.
 */
export function refuse(statusCode: number, message: string, fields: FieldMessages = {}, extra: Record<string, unknown> = {}): never {
  throw createError({ statusCode, statusMessage: reasons[statusCode] ?? 'Refused', message, data: { ...extra, message, fields } })
}

/** Refuses with messages for several fields; the summary names the first one. */
export function refuseFields(fields: FieldMessages, statusCode = 400, extra: Record<string, unknown> = {}): never {
  const [path, message] = Object.entries(fields)[0] ?? ['_', 'Invalid input']
  refuse(statusCode, path === '_' ? message : `${path}: ${message}`, fields, extra)
}

/** Refuses because of one field, e.g. `refuseField('date', 'This day is full')`. */
export function refuseField(field: string, message: string, statusCode = 400): never {
  refuseFields({ [field]: message }, statusCode)
}

export function notFound(what = 'Not found'): never {
  refuse(404, what)
}

function invalid(error: z.ZodError, where: string): never {
  const fields = fieldErrors(error)
  const first = Object.entries(fields)[0]
  refuse(400, first ? `${first[0] === '_' ? where : first[0]}: ${first[1]}` : `Invalid ${where}`, fields)
}

/** Reads a JSON body and validates it; malformed JSON and failed checks are 400s with field messages. */
export async function readBodyWith<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.output<S>> {
  let body: unknown
  try {
    body = await readBody(event)
  }
  catch {
    refuseField('_', 'The request body is not valid JSON')
  }
  const result = schema.safeParse(body ?? {})
  if (!result.success) invalid(result.error, 'body')
  return result.data
}

export function queryWith<S extends z.ZodType>(event: H3Event, schema: S): z.output<S> {
  const result = schema.safeParse(getQuery(event))
  if (!result.success) invalid(result.error, 'query')
  return result.data
}

export function paramsWith<S extends z.ZodType>(event: H3Event, schema: S): z.output<S> {
  const result = schema.safeParse(getRouterParams(event, { decode: true }))
  if (!result.success) invalid(result.error, 'path')
  return result.data
}
