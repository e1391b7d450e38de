import { assignmentSeries } from '../../db/schema'
import { assignSchema } from '#shared/schemas/planner'
import { seriesDates } from '#shared/utils/dates'

/** Assigns a routine to athletes and/or a squad on dates or a weekly repeat: one transaction, one e-mail per athlete. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const body = await readBodyWith(event, assignSchema)
  const db = await useDb()

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

  const created = await db.transaction(async (tx) => {
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
      plan: athletes.map(athlete => ({ athlete, dates, note: combineNotes(body.note, body.athleteNotes?.[String(athlete.id)]) })),
    })
    return { seriesId, ids: assignmentIds }
  })

  setResponseStatus(event, 201)
  return { created: created.ids.length, ids: created.ids, seriesId: created.seriesId, dates, athleteIds: athletes.map(athlete => athlete.id) }
})
