import type { H3Event } from 'h3'

/**
 * One JSON line per request and per background job run, on stdout. Never passwords, tokens, note text
 * or bodies: only what identifies the request, who made it and how it ended.
 */
export function logLine(fields: Record<string, unknown>) {
  pending.push(`${JSON.stringify({ time: new Date().toISOString(), ...fields })}\n`)
  if (pending.length === 1) setImmediate(flushLog)
}

// The lines of one turn of the event loop go out in one write: writing to a pipe is a system call, made
// synchronously, and a rendered page logs itself and each of its internal API calls (about 5 % of its CPU
// when written one by one). Flushed at the end of the turn and when the process exits, so a normal stop
// or process.exit loses no line.
let pending: string[] = []

function flushLog() {
  if (!pending.length) return
  const lines = pending.join('')
  pending = []
  process.stdout.write(lines)
}

process.once('exit', flushLog)

export function logJob(job: string, fields: Record<string, unknown>) {
  logLine({ kind: 'job', job, pid: process.pid, ...fields })
}

/** An error's class and code, without its message (which may quote input). */
export function errorSummary(error: unknown) {
  const value = error as { name?: string, code?: string, cause?: { code?: string } } | undefined
  return { name: value?.name ?? typeof error, code: value?.code ?? value?.cause?.code }
}

/** A route pattern for the log: the matched API pattern, or the page path with token-like parts hidden. */
function routeOf(matched: string | undefined, path: string) {
  if (matched && !matched.includes('**')) return matched
  return path.split('?')[0]!.split('/').map(part => /^[\w-]{16,}(\.\w+)?$/.test(part) ? ':token' : part).join('/')
}

/** The request's one log line: once, whichever of the response and error paths gets there first. */
export function logRequest(event: H3Event, status: number) {
  if (event.context.requestLogged) return
  event.context.requestLogged = true
  const caller = event.context.caller as { userId?: number, teamId?: number } | undefined
  const started = event.context.requestStartedAt as number | undefined
  logLine({
    kind: 'request',
    requestId: event.context.requestId,
    method: event.method,
    route: routeOf(event.context.matchedRoute?.path, event.path),
    status,
    durationMs: started === undefined ? null : Math.round((performance.now() - started) * 10) / 10,
    userId: caller?.userId ?? null,
    teamId: caller?.teamId ?? null,
    ...(event.context.errorCode ? { errorCode: event.context.errorCode } : {}),
  })
}
