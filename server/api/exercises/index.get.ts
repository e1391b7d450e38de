import { and, asc, count, desc, eq, inArray, isNotNull, isNull, sql, type SQL } from 'drizzle-orm'
import type { z } from 'zod'
import { exerciseListQuerySchema } from '#shared/schemas/exercise'
import type { Caller } from '../../utils/auth'
import { exercises, mediaObjects } from '../../db/schema'

const listedColumns = {
  ...exerciseListColumns,
  posterId: exercises.posterId,
  createdAt: exercises.createdAt,
  updatedAt: exercises.updatedAt,
}
const clipColumns = {
  contentType: mediaObjects.contentType,
  size: mediaObjects.size,
  durationSeconds: mediaObjects.durationSeconds,
  width: mediaObjects.width,
  height: mediaObjects.height,
}

function likePattern(text: string) {
  return `%${text.toLowerCase().replace(/[\\%_]/g, match => `\\${match}`)}%`
}

export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event, 'athlete')
  const query = queryWith(event, exerciseListQuerySchema)
  return keptAnswer(event, caller, () => listExercises(caller, query))
})

async function listExercises(caller: Caller, query: z.output<typeof exerciseListQuerySchema>) {
  const db = await useDb()

  const conditions: (SQL | undefined)[] = [eq(exercises.teamId, caller.teamId)]
  if (!isCoachRole(caller.role)) {
    const ids = await athleteExerciseIds(db, caller.teamId, caller.userId)
    conditions.push(ids.length ? inArray(exercises.id, ids) : sql`0`)
  }
  if (query.status === 'active') conditions.push(isNull(exercises.archivedAt))
  if (query.status === 'archived') conditions.push(isNotNull(exercises.archivedAt))
  if (query.q) conditions.push(sql`(lower(${exercises.name}) LIKE ${likePattern(query.q)} ESCAPE '\\' OR lower(${exercises.summary}) LIKE ${likePattern(query.q)} ESCAPE '\\')`)
  if (query.category) conditions.push(eq(exercises.category, query.category))
  if (query.equipment) conditions.push(sql`EXISTS (SELECT 1 FROM json_each(${exercises.equipment}) WHERE lower(json_each.value) = lower(${query.equipment}))`)
  if (query.hasClip === true) conditions.push(isNotNull(exercises.clipId))
  if (query.hasClip === false) conditions.push(isNull(exercises.clipId))
  const where = and(...conditions)

  const direction = query.dir === 'desc' ? desc : asc
  const byName = direction(sql`lower(${exercises.name})`)
  const order = {
    name: [byName],
    category: [direction(exercises.category), asc(sql`lower(${exercises.name})`)],
    updated: [direction(exercises.updatedAt), asc(sql`lower(${exercises.name})`)],
    clip: [direction(sql`${exercises.clipId} IS NOT NULL`), asc(sql`lower(${exercises.name})`)],
  }[query.sort]

  const coach = isCoachRole(caller.role)
  const [rows, equipment] = await Promise.all([
    // Only the columns the list shows, and the count of all matches in the same statement.
    db.select({ exercise: listedColumns, clip: clipColumns, total: sql<number>`count(*) OVER ()` })
      .from(exercises)
      .leftJoin(mediaObjects, eq(mediaObjects.id, exercises.clipId))
      .where(where)
      .orderBy(...order, asc(exercises.id))
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize),
    // Every piece of equipment the team's library names, for the coach's filter.
    coach
      ? db.all<{ item: string }>(sql`SELECT DISTINCT json_each.value AS item FROM ${exercises}, json_each(${exercises.equipment}) WHERE ${exercises.teamId} = ${caller.teamId} ORDER BY lower(json_each.value)`)
      : [],
  ])
  // A page past the end has no row to carry the count.
  const total = rows[0]?.total ?? (query.page > 1 ? (await db.select({ total: count() }).from(exercises).where(where))[0]?.total ?? 0 : 0)

  return {
    items: rows.map(row => exerciseView(row.exercise, row.clip)),
    total,
    page: query.page,
    pageSize: query.pageSize,
    equipmentOptions: equipment.map(row => row.item),
  }
}
