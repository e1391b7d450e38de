import { and, eq, inArray } from 'drizzle-orm'
import { assignmentBatches, assignments, assignmentSeries } from '../../db/schema'
import { assignSchema } from '#shared/schemas/planner'
import { seriesDates } from '#shared/utils/dates'

interface BatchResult {
  created: number
  ids: number[]
  seriesId: number | null
  dates: string[]
  athleteIds: number[]
  /** Sessions left out because the athlete already had this routine that day (send `confirmDuplicates` to plan them). */
  skipped: { athleteId: number, name: string, date: string }[]
}

/**
 * Assigns a routine to athletes and/or a squad on dates or a weekly repeat: one transaction, one e-mail per athlete.
 * The same routine again for the same athlete and day is skipped unless confirmed; a repeated idempotency key
 * returns the first batch's answer.
 */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const body = await readBodyWith(event, assignSchema)
  const db = await useDb()

  if (body.idempotencyKey) {
    const [done] = await db.select({ result: assignmentBatches.result }).from(assignmentBatches)
      .where(and(eq(assignmentBatches.teamId, caller.teamId), eq(assignmentBatches.idempotencyKey, body.idempotencyKey))).limit(1)
    if (done) return { ...(done.result as unknown as BatchResult), repeated: true }
  }

  const ids = new Set(body.athleteIds ?? [])
  if (body.squadId) {
    await findTeamSquad(db, caller.teamId, body.squadId)
    const members = await squadAthletes(db, caller.teamId, body.squadId)
    if (!members.length && !ids.size) refuseField('squadId', 'This squad has no athletes yet')
    members.forEach(id => ids.add(id))
  }
  const athletes = await assertTeamAthletes(db, caller.teamId, [...ids])
  for (const key of Object.keys(body.athleteNotes ?? {})) {
    if (!ids.has(Number(key))) refuseField(`athleteNotes.${key}`, 'This athlete is not in the batch')
  }

  const dates = body.series ? seriesDates(body.series) : [...new Set(body.dates)].sort()
  if (dates.length * athletes.length > MAX_BATCH_ASSIGNMENTS) {
    refuseField(body.series ? 'series' : 'dates', `That makes ${dates.length * athletes.length} sessions; assign at most ${MAX_BATCH_ASSIGNMENTS} at once`)
  }

  const { routine, snapshot } = await snapshotRoutine(db, caller.teamId, body.routineId)

  const existing = body.confirmDuplicates || !athletes.length
    ? []
    : await db.select({ athleteId: assignments.athleteId, date: assignments.date }).from(assignments)
        .where(and(eq(assignments.teamId, caller.teamId), eq(assignments.routineId, routine.id), inArray(assignments.athleteId, athletes.map(athlete => athlete.id)), inArray(assignments.date, dates)))
  const taken = new Set(existing.map(row => `${row.athleteId} ${row.date}`))
  const skipped = athletes.flatMap(athlete => dates.filter(date => taken.has(`${athlete.id} ${date}`)).map(date => ({ athleteId: athlete.id, name: athlete.name, date })))

  const result = await db.transaction(async (tx) => {
    if (body.idempotencyKey) {
      // The unique (team, key) index makes a simultaneous second request fail here instead of planning twice.
      const claimed = await tx.insert(assignmentBatches).values({ teamId: caller.teamId, idempotencyKey: body.idempotencyKey, createdById: caller.userId })
        .onConflictDoNothing().returning({ id: assignmentBatches.id })
      if (!claimed.length) refuse(409, 'This plan is already being saved')
    }
    let seriesId: number | null = null
    if (body.series) {
      const [series] = await tx.insert(assignmentSeries).values({
        teamId: caller.teamId,
        routineId: routine.id,
        squadId: body.squadId ?? null,
        startDate: body.series.startDate,
        weeks: body.series.weeks,
        weekdays: [...body.series.weekdays].sort(),
        note: body.note,
        createdById: caller.userId,
      }).returning({ id: assignmentSeries.id })
      seriesId = series!.id
    }
    const assignmentIds = await insertBatch(tx, {
      teamId: caller.teamId,
      teamName: caller.teamName,
      coach: { id: caller.userId, name: caller.name },
      routine,
      snapshot,
      seriesId,
      plan: athletes.map(athlete => ({
        athlete,
        dates: dates.filter(date => !taken.has(`${athlete.id} ${date}`)),
        note: combineNotes(body.note, body.athleteNotes?.[String(athlete.id)]),
      })),
    })
    const result: BatchResult = { created: assignmentIds.length, ids: assignmentIds, seriesId, dates, athleteIds: athletes.map(athlete => athlete.id), skipped }
    if (body.idempotencyKey) {
      await tx.update(assignmentBatches).set({ result: result as unknown as Record<string, unknown> })
        .where(and(eq(assignmentBatches.teamId, caller.teamId), eq(assignmentBatches.idempotencyKey, body.idempotencyKey)))
    }
    return result
  })

  setResponseStatus(event, 201)
  return { ...result, repeated: false }
})
