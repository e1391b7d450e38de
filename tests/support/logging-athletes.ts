import { Agent, request } from 'node:http'
import { createClient } from '@libsql/client'
import { hashPassword } from '../../seeds/context'
import { ApiClient } from './client'

export const LOGGER_PASSWORD = 'logging-athlete-password'

export interface LoggingAthlete {
  client: ApiClient
  userId: number
  sessionId: number
  /** The entry bodies this athlete will send, one per round, each with its own idempotency key. */
  entries: { idempotencyKey: string, stepId: string, round: number, seconds: number, rpe: number }[]
}

/**
 * A team of `count` athletes, each signed in through `url` with a session started on a routine of
 * `rounds` timed efforts: the shape of a squad logging a circuit at the same moment. The rows are
 * written straight into the database (one password hash for all), the sign-ins go through the app.
 */
export async function seedLoggingAthletes(databaseUrl: string, url: string, count: number, rounds: number, headers: Record<string, string> = {}) {
  const db = createClient({ url: databaseUrl, timeout: 5000 })
  const tag = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`
  const passwordHash = await hashPassword(LOGGER_PASSWORD)
  const team = await db.execute({ sql: 'insert into teams (name) values (?) returning id', args: [`Larchford Night Loggers ${tag}`] })
  const teamId = Number(team.rows[0]!.id)
  const steps = [{ id: 'rounds', type: 'repeat', times: rounds, steps: [{ id: 'effort', type: 'block', kind: 'work', measure: { by: 'time', seconds: 30 } }] }]
  const snapshot = { title: 'Circuit rounds', category: 'strength', description: '', exercises: [], steps }
  const routine = await db.execute({ sql: 'insert into routines (team_id, title, category, description, steps, version) values (?, ?, ?, ?, ?, 1) returning id', args: [teamId, snapshot.title, 'strength', '', JSON.stringify(steps)] })
  const routineId = Number(routine.rows[0]!.id)
  const today = new Date().toISOString().slice(0, 10)

  const athletes: LoggingAthlete[] = []
  for (let index = 0; index < count; index += 1) {
    const email = `logger${index}.${tag}@example.test`
    const user = await db.execute({ sql: 'insert into users (email, name, password_hash) values (?, ?, ?) returning id', args: [email, `Logger ${index + 1}`, passwordHash] })
    const userId = Number(user.rows[0]!.id)
    await db.execute({ sql: 'insert into memberships (team_id, user_id, role) values (?, ?, ?)', args: [teamId, userId, 'athlete'] })
    const assignment = await db.execute({
      sql: 'insert into assignments (team_id, athlete_id, routine_id, routine_version, snapshot, date, status) values (?, ?, ?, 1, ?, ?, ?) returning id',
      args: [teamId, userId, routineId, JSON.stringify(snapshot), today, 'planned'],
    })
    const client = new ApiClient(url, headers)
    const signedIn = await client.post('/api/auth/login', { email, password: LOGGER_PASSWORD })
    if (signedIn.status !== 200) throw new Error(`sign-in failed: ${signedIn.status} ${signedIn.text}`)
    const clientId = `run-${tag}-${index}`
    const session = await client.post<{ id: number }>(`/api/assignments/${Number(assignment.rows[0]!.id)}/sessions`, { clientId })
    if (session.status !== 201) throw new Error(`start failed: ${session.status} ${session.text}`)
    athletes.push({ client, userId, sessionId: session.data.id, entries: roundEntries(clientId, rounds) })
  }
  db.close()

  /** Gives `athlete` a new assignment for today and starts it: the next session of a long run. */
  async function nextSession(athlete: LoggingAthlete, run: number) {
    const writer = createClient({ url: databaseUrl, timeout: 5000 })
    const assignment = await writer.execute({
      sql: 'insert into assignments (team_id, athlete_id, routine_id, routine_version, snapshot, date, status) values (?, ?, ?, 1, ?, ?, ?) returning id',
      args: [teamId, athlete.userId, routineId, JSON.stringify(snapshot), today, 'planned'],
    })
    writer.close()
    const clientId = `run-${tag}-${athlete.userId}-${run}`
    const session = await athlete.client.post<{ id: number }>(`/api/assignments/${Number(assignment.rows[0]!.id)}/sessions`, { clientId })
    if (session.status !== 201) throw new Error(`start failed: ${session.status} ${session.text}`)
    athlete.sessionId = session.data.id
    athlete.entries = roundEntries(clientId, rounds)
  }
  return { teamId, athletes, nextSession }
}

function roundEntries(clientId: string, rounds: number): LoggingAthlete['entries'] {
  return Array.from({ length: rounds }, (_, round) => ({ idempotencyKey: `${clientId}:effort:${round + 1}:0`, stepId: 'effort', round: round + 1, seconds: 30, rpe: 6 }))
}

export interface Acknowledged { keys: Set<string>, byStatus: Map<number, number>, latenciesMs: number[] }

/** Sends each athlete's entries one after another, all athletes at once; records what was acknowledged. */
export async function logEverything(athletes: LoggingAthlete[], pick: (athlete: LoggingAthlete) => LoggingAthlete['entries'] = athlete => athlete.entries, onAcknowledged?: (count: number) => void) {
  const result: Acknowledged = { keys: new Set(), byStatus: new Map(), latenciesMs: [] }
  await Promise.all(athletes.map(async (athlete) => {
    for (const entry of pick(athlete)) {
      const started = performance.now()
      let status = 0
      try {
        status = await postEntry(athlete, entry)
      }
      catch {
        status = 0 // the connection broke: not acknowledged, the client's outbox sends it again
      }
      result.latenciesMs.push(performance.now() - started)
      result.byStatus.set(status, (result.byStatus.get(status) ?? 0) + 1)
      if (status === 200 || status === 201) {
        result.keys.add(entry.idempotencyKey)
        onAcknowledged?.(result.keys.size)
      }
    }
  }))
  return result
}

/** One keep-alive connection per athlete, as each phone holds its own. */
const connections = new WeakMap<LoggingAthlete, Agent>()

/**
 * Posts one entry and answers its status. Plain `node:http` on the athlete's own kept-alive connection rather
 * than `fetch`: with 50 athletes sending as fast as the server answers, `fetch` cost this process about as much
 * CPU per write as the server spent storing it, and the two share the machine's cores (docs/performance.md).
 */
function postEntry(athlete: LoggingAthlete, entry: LoggingAthlete['entries'][number]) {
  let agent = connections.get(athlete)
  if (!agent) {
    agent = new Agent({ keepAlive: true, maxSockets: 1 })
    connections.set(athlete, agent)
  }
  const body = JSON.stringify(entry)
  const url = new URL(`/api/sessions/${athlete.sessionId}/entries`, athlete.client.baseUrl)
  return new Promise<number>((resolve, reject) => {
    const sent = request(url, {
      method: 'POST',
      agent,
      headers: {
        'accept': 'application/json',
        ...athlete.client.headers,
        'content-type': 'application/json',
        'content-length': Buffer.byteLength(body),
        'cookie': athlete.client.cookieHeader(),
      },
    }, (response) => {
      response.resume()
      response.once('end', () => resolve(response.statusCode ?? 0))
      response.once('error', reject)
    })
    sent.once('error', reject)
    sent.end(body)
  })
}
