import { createClient, type Client } from '@libsql/client'
import type { AssignmentSnapshot, ExerciseCaution } from '../../shared/types/domain'
import type { RoutineStep } from '../../shared/schemas/routine-steps'
import type { Stack } from './stack'

// Rows written straight into the test database, for tests whose subject needs routines, exercises
// or assignments without going through the coach's pages or routes.

export interface ExerciseFixture {
  name: string
  category?: string
  summary?: string
  cues?: string[]
  equipment?: string[]
  cautions?: ExerciseCaution[]
}

export class Fixtures {
  readonly client: Client
  constructor(stack: Stack) {
    // The server writes too (the e-mail outbox runs in the background): wait for its lock, as the server does.
    this.client = createClient({ url: stack.databaseUrl, timeout: 5000 })
  }

  async exercise(teamId: number, exercise: ExerciseFixture) {
    const result = await this.client.execute({
      sql: 'insert into exercises (team_id, name, category, summary, cues, equipment, cautions) values (?, ?, ?, ?, ?, ?, ?) returning id',
      args: [teamId, exercise.name, exercise.category ?? 'strength', exercise.summary ?? '', JSON.stringify(exercise.cues ?? []), JSON.stringify(exercise.equipment ?? []), JSON.stringify(exercise.cautions ?? [])],
    })
    const id = Number(result.rows[0]!.id)
    return { id, name: exercise.name, category: exercise.category ?? 'strength', summary: exercise.summary ?? '', cues: exercise.cues ?? [], equipment: exercise.equipment ?? [], cautions: exercise.cautions ?? [] }
  }

  async routine(teamId: number, routine: { title: string, category?: string, description?: string, steps: RoutineStep[] }) {
    const result = await this.client.execute({
      sql: 'insert into routines (team_id, title, category, description, steps, version) values (?, ?, ?, ?, ?, 1) returning id',
      args: [teamId, routine.title, routine.category ?? 'strength', routine.description ?? '', JSON.stringify(routine.steps)],
    })
    return Number(result.rows[0]!.id)
  }

  /** A routine and an assignment of its snapshot to one athlete on `date` (today, UTC, by default). */
  async assignment(teamId: number, athleteId: number, snapshot: AssignmentSnapshot, options: { date?: string, status?: string, routineId?: number } = {}) {
    const routineId = options.routineId ?? await this.routine(teamId, { title: snapshot.title, category: snapshot.category, description: snapshot.description, steps: snapshot.steps })
    const result = await this.client.execute({
      sql: 'insert into assignments (team_id, athlete_id, routine_id, routine_version, snapshot, date, status) values (?, ?, ?, 1, ?, ?, ?) returning id',
      args: [teamId, athleteId, routineId, JSON.stringify(snapshot), options.date ?? new Date().toISOString().slice(0, 10), options.status ?? 'planned'],
    })
    return { id: Number(result.rows[0]!.id), routineId }
  }

  async injuryNote(teamId: number, athleteId: number, bodyArea: string, note = '', status = 'active') {
    const result = await this.client.execute({
      sql: 'insert into injury_notes (team_id, athlete_id, body_area, status, note) values (?, ?, ?, ?, ?) returning id',
      args: [teamId, athleteId, bodyArea, status, note],
    })
    return Number(result.rows[0]!.id)
  }

  async rows<T = Record<string, unknown>>(sql: string, args: (string | number | null)[] = []) {
    const result = await this.client.execute({ sql, args })
    return result.rows as unknown as T[]
  }

  close() {
    this.client.close()
  }
}
