import type { z } from 'zod'

/** Field-level messages keyed by dotted path, e.g. `{ "steps.2.measure.seconds": "…" }`. */
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {}
  for (const issue of error.issues) {
    const path = issue.path.map(String).join('.') || '_'
    fields[path] ??= issue.message
  }
  return fields
}
