import { createClient, type Client } from '@libsql/client'
import type { Stack } from './stack'

/** Direct access to the test database, for rows another part of the app would write (routines, exercises, logs). */
export function openTestDb(stack: Stack): Client {
  // A busy timeout, so a write here waits for the app server's writes instead of failing with SQLITE_BUSY.
  return createClient({ url: stack.databaseUrl, timeout: 5000 })
}

export async function insertExercise(db: Client, teamId: number, exercise: { name: string, category?: string, cues?: string[], cautions?: { text: string, bodyAreas: string[] }[] }) {
  const result = await db.execute({
    sql: 'insert into exercises (team_id, name, category, summary, cues, equipment, cautions) values (?, ?, ?, ?, ?, ?, ?) returning id',
    args: [teamId, exercise.name, exercise.category ?? 'hill', 'Drive the arms, tall posture', JSON.stringify(exercise.cues ?? ['Lean from the ankles']), '[]', JSON.stringify(exercise.cautions ?? [])],
  })
  return Number(result.rows[0]!.id)
}

/** 8 × (60 s uphill hard, 90 s jog back down) after a warm-up: a valid step tree. */
export function hillSteps(exerciseId?: number, times = 8) {
  return [
    { id: 'warm', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 600 } },
    {
      id: 'reps',
      type: 'repeat',
      times,
      skipLastRecovery: true,
      steps: [
        { id: 'up', type: 'block', kind: 'work', measure: { by: 'time', seconds: 60 }, grade: 0.06, target: { type: 'effort', rpe: 8 }, ...(exerciseId ? { exerciseId } : {}) },
        { id: 'down', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 90 } },
      ],
    },
    { id: 'cool', type: 'block', kind: 'cooldown', measure: { by: 'time', seconds: 600 } },
  ]
}

export async function insertRoutine(db: Client, teamId: number, routine: { title: string, category?: string, steps?: unknown[], archived?: boolean }) {
  const result = await db.execute({
    sql: 'insert into routines (team_id, title, category, description, steps, version, archived_at) values (?, ?, ?, ?, ?, 1, ?) returning id',
    args: [teamId, routine.title, routine.category ?? 'hills', 'Hill reps on the ridge road', JSON.stringify(routine.steps ?? hillSteps()), routine.archived ? Date.now() : null],
  })
  return Number(result.rows[0]!.id)
}

export async function countRows(db: Client, table: 'assignments' | 'assignment_series' | 'email_outbox', teamId: number) {
  const result = await db.execute({ sql: `select count(*) as n from ${table} where team_id = ?`, args: [teamId] })
  return Number(result.rows[0]!.n)
}

/** Waits until the outbox has nothing left to send, so a test can count what arrived. */
export async function outboxSettled(db: Client, timeoutMs = 10_000) {
  const deadline = Date.now() + timeoutMs
  while (Date.now() < deadline) {
    const result = await db.execute('select count(*) as n from email_outbox where status in (\'pending\', \'sending\')')
    if (Number(result.rows[0]!.n) === 0) return
    await new Promise(resolve => setTimeout(resolve, 50))
  }
  throw new Error('The outbox did not settle')
}
