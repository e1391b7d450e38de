import type { H3Event } from 'h3'
import type { z } from 'zod'
import { fieldErrors } from '../../shared/utils/errors'

function invalid(error: z.ZodError, where: string): never {
  const fields = fieldErrors(error)
  const first = Object.entries(fields)[0]
  throw createError({
    statusCode: 400,
    statusMessage: 'Invalid input',
    message: first ? `${first[0] === '_' ? where : first[0]}: ${first[1]}` : `Invalid ${where}`,
    data: { fields },
  })
}

/** Reads a JSON body and validates it; malformed JSON and failed checks are 400s with field messages. */
export async function readBodyWith<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.output<S>> {
  let body: unknown
  try {
    body = await readBody(event)
  }
  catch {
    throw createError({ statusCode: 400, statusMessage: 'Invalid input', message: 'The request body is not valid JSON', data: { fields: { _: 'The request body is not valid JSON' } } })
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
      const message = `The request body is nested deeper than ${MAX_BODY_DEPTH} levels`
      throw createError({ statusCode: 400, statusMessage: 'Invalid input', message, data: { fields: { _: message } } })
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

export function notFound(what = 'Not found'): never {
  throw createError({ statusCode: 404, statusMessage: 'Not found', message: what })
}

/** Whether a database error is a unique-index violation (a race lost to a simultaneous request). */
export function isUniqueViolation(error: unknown): boolean {
  for (let current = error; current; current = (current as { cause?: unknown }).cause) {
    if (/UNIQUE constraint failed|SQLITE_CONSTRAINT_UNIQUE|SQLITE_CONSTRAINT_PRIMARYKEY/i.test(String((current as Error).message ?? current)) || (current as { code?: string }).code === 'SQLITE_CONSTRAINT_UNIQUE') return true
    if (current === (current as { cause?: unknown }).cause) break
  }
  return false
}
