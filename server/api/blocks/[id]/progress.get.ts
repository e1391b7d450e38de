import { and, eq, inArray, isNotNull } from 'drizzle-orm'
import { assignments, sessionLogs, squadMembers, squads, users } from '../../../db/schema'
import { idParamsSchema } from '#shared/schemas/common'
import { todayIn } from '#shared/utils/dates'
import { keyNumbers, weekOfBlock } from '#shared/utils/progression'
import { blockProgressSeries, type ProgressRow } from '#shared/utils/block-progress'

/** Planned against done, week by week: for every athlete in the block, each of its squads, and everyone. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const loaded = await loadBlock(db, caller.teamId, id)
  const rows = await db.select({ id: assignments.id, athleteId: assignments.athleteId, week: assignments.blockWeek, snapshot: assignments.snapshot, status: assignments.status, name: shownAthleteName(caller.teamId, assignments.athleteId) })
    .from(assignments).innerJoin(users, eq(users.id, assignments.athleteId))
    .where(and(eq(assignments.teamId, caller.teamId), eq(assignments.blockId, id)))
  const ids = rows.map(row => row.id)
  const logs = ids.length
    ? await db.select({ assignmentId: sessionLogs.assignmentId, durationS: sessionLogs.durationS }).from(sessionLogs)
        .where(and(eq(sessionLogs.teamId, caller.teamId), inArray(sessionLogs.assignmentId, ids), isNotNull(sessionLogs.finishedAt)))
    : []
  const doneS = new Map<number, number>()
  for (const log of logs) doneS.set(log.assignmentId, (doneS.get(log.assignmentId) ?? 0) + (log.durationS ?? 0))
  const members = loaded.targets.squadIds.length
    ? await db.select({ squadId: squadMembers.squadId, userId: squadMembers.userId, name: squads.name }).from(squadMembers)
        .innerJoin(squads, eq(squads.id, squadMembers.squadId))
        .where(and(eq(squads.teamId, caller.teamId), inArray(squadMembers.squadId, loaded.targets.squadIds)))
    : []
  const progressRows: ProgressRow[] = rows.filter(row => row.week !== null).map(row => ({
    athleteId: row.athleteId,
    athleteName: row.name,
    week: row.week!,
    plannedMin: keyNumbers(row.snapshot.steps).durationS / 60,
    doneMin: (doneS.get(row.id) ?? 0) / 60,
    done: row.status === 'done' || row.status === 'partial',
  }))
  const squadsList = [...new Map(members.map(member => [member.squadId, member.name])).entries()].map(([squadId, name]) => ({
    id: squadId,
    name,
    athleteIds: members.filter(member => member.squadId === squadId).map(member => member.userId),
  }))
  return {
    weeks: loaded.block.weeks,
    currentWeek: weekOfBlock(loaded.block.startDate, loaded.block.weeks, todayIn(caller.timezone)),
    series: blockProgressSeries(progressRows, loaded.block.weeks, squadsList),
  }
})
