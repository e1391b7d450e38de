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
  assertShallow(body)
  const result = schema.safeParse(body ?? {})
  if (!result.success) invalid(result.error, 'body')
  return result.data
}

/** No request body nests deeper than this (a routine's steps need well under half of it). */
export const MAX_BODY_DEPTH = 32

/**
 * Refuses a body nested deeper than `MAX_BODY_DEPTH` before any schema walks it: recursive zod
 * schemas would otherwise overflow the stack on a few thousand levels. Walks without recursion.
 */
export function assertShallow(body: unknown) {
  const stack: [unknown, number][] = [[body, 1]]
  while (stack.length) {
    const [value, depth] = stack.pop()!
    if (value === null || typeof value !== 'object') continue
    if (depth > MAX_BODY_DEPTH) {
      refuseField('_', `The request body is nested deeper than ${MAX_BODY_DEPTH} levels`)
    }
    for (const child of Object.values(value)) {
      if (child !== null && typeof child === 'object') stack.push([child, depth + 1])
    }
  }
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

/** Whether a database error is a unique-index violation (a race lost to a simultaneous request). */
export function isUniqueViolation(error: unknown): boolean {
  for (let current = error; current; current = (current as { cause?: unknown }).cause) {
    if (/UNIQUE constraint failed|SQLITE_CONSTRAINT_UNIQUE|SQLITE_CONSTRAINT_PRIMARYKEY/i.test(String((current as Error).message ?? current)) || (current as { code?: string }).code === 'SQLITE_CONSTRAINT_UNIQUE') return true
    if (current === (current as { cause?: unknown }).cause) break
  }
  return false
}
