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

export function notFound(what = 'Not found'): never {
  throw createError({ statusCode: 404, statusMessage: 'Not found', message: what })
}
