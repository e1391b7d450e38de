import type { z } from 'zod'

/** Field-level messages keyed by dotted path, e.g. `{ "steps.2.measure.seconds": "…" }`; `_` is the whole request. */
export type FieldMessages = Record<string, string>

/** The `data` of every refusal the server sends (see server/utils/validation.ts). */
export interface RefusalData {
  message?: string
  fields?: FieldMessages
  [extra: string]: unknown
}

export function fieldErrors(error: z.ZodError): FieldMessages {
  const fields: FieldMessages = {}
  for (const issue of error.issues) {
    const path = issue.path.map(String).join('.') || '_'
    fields[path] ??= issue.message
  }
  return fields
}

/** The message for a field or anything under it (`series` finds `series.weeks`); the first key given wins. */
export function errorUnder(fields: FieldMessages, ...keys: string[]): string | undefined {
  return keys.map(key => fields[key]).find(Boolean)
    ?? Object.entries(fields).find(([key]) => keys.some(prefix => key.startsWith(`${prefix}.`)))?.[1]
}
