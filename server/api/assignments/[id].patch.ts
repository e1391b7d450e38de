import { and, eq } from 'drizzle-orm'
import { assignments } from '../../db/schema'
import { idParamsSchema } from '#shared/schemas/common'
import { assignmentPatchSchema } from '#shared/schemas/planner'

/**
 * Moves an assignment to another day and/or athlete, or changes its note. Work already done stays where it is.
 * A move e-mails the athlete (both athletes, when it changes hands), batched per athlete per day.
 */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const body = await readBodyWith(event, assignmentPatchSchema)
  const db = await useDb()
  const [assignment] = await db.select().from(assignments).where(and(eq(assignments.id, id), eq(assignments.teamId, caller.teamId))).limit(1)
  if (!assignment) notFound('No such assignment')
  const newDate = body.date && body.date !== assignment.date ? body.date : null
  const newAthlete = body.athleteId && body.athleteId !== assignment.athleteId ? body.athleteId : null
  if ((newDate || newAthlete) && assignment.status !== 'planned') {
    const field = newDate ? 'date' : 'athleteId'
    refuseField(field, 'This session has been logged, so it stays where it is', 409)
  }
  const people = await athletesById(db, caller.teamId, [assignment.athleteId, ...(newAthlete ? [newAthlete] : [])])
  if (newAthlete && !people.some(person => person.id === newAthlete)) {
    refuseField('athleteId', 'This athlete is not in your team')
  }
  const updated = await db.transaction(async (tx) => {
    const [updated] = await tx.update(assignments)
      .set({ ...(newDate ? { date: newDate } : {}), ...(newAthlete ? { athleteId: newAthlete } : {}), ...(body.note !== undefined ? { note: body.note } : {}) })
      .where(and(eq(assignments.id, id), eq(assignments.teamId, caller.teamId)))
      .returning({ id: assignments.id, date: assignments.date, note: assignments.note, athleteId: assignments.athleteId })
    const title = assignment.snapshot.title
    const before = people.find(person => person.id === assignment.athleteId)
    const after = people.find(person => person.id === newAthlete)
    const notice = { teamId: caller.teamId, teamName: caller.teamName }
    if (newAthlete) {
      if (before) await queuePlanChange(tx, { ...notice, athlete: before, change: { kind: 'removed', title, from: assignment.date } })
      if (after) await queuePlanChange(tx, { ...notice, athlete: after, change: { kind: 'added', title, to: updated!.date } })
    }
    else if (newDate && before) {
      await queuePlanChange(tx, { ...notice, athlete: before, change: { kind: 'moved', title, from: assignment.date, to: newDate } })
    }
    return updated
  })
  return updated
})
