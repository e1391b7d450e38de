import { and, eq, sql } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { EXERCISE_LIMITS } from '#shared/schemas/exercise'
import { clipCues, exercises, mediaObjects } from '../../../db/schema'
import type { Database } from '../../../db/client'

async function freeCopyName(db: Database, teamId: number, name: string) {
  const taken = new Set((await db.select({ name: exercises.name }).from(exercises)
    .where(and(eq(exercises.teamId, teamId), sql`lower(${exercises.name}) LIKE lower(${`${name.slice(0, EXERCISE_LIMITS.name - 12)}%`})`)))
    .map(row => row.name.toLowerCase()))
  for (let n = 1; ; n++) {
    const suffix = n === 1 ? ' (copy)' : ` (copy ${n})`
    const candidate = `${name.slice(0, EXERCISE_LIMITS.name - suffix.length)}${suffix}`
    if (!taken.has(candidate.toLowerCase())) return candidate
  }
}

/** A new, active exercise with the same content; its clip and poster are copied to its own keys. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const { exercise } = await findTeamExercise(db, caller, id)
  const name = await freeCopyName(db, caller.teamId, exercise.name)
  const [copy] = await db.insert(exercises).values({
    teamId: caller.teamId,
    name,
    category: exercise.category,
    summary: exercise.summary,
    cues: exercise.cues,
    equipment: exercise.equipment,
    cautions: exercise.cautions,
    createdById: caller.userId,
  }).returning()

  const media = await db.select().from(mediaObjects).where(and(
    eq(mediaObjects.teamId, caller.teamId),
    eq(mediaObjects.status, 'ready'),
    sql`${mediaObjects.id} IN (${exercise.clipId ?? 0}, ${exercise.posterId ?? 0})`,
  ))
  let mediaCopied = true
  let updated = copy!
  let clip: typeof mediaObjects.$inferSelect | undefined
  for (const original of media) {
    const key = newExerciseKey(caller.teamId, copy!.id, original.contentType)
    try {
      await copyObject(original.key, key)
    }
    catch {
      mediaCopied = false
      continue
    }
    const saved = await db.transaction(async (tx) => {
      const [row] = await tx.insert(mediaObjects).values({
        teamId: caller.teamId,
        exerciseId: copy!.id,
        key,
        purpose: original.purpose,
        contentType: original.contentType,
        size: original.size,
        durationSeconds: original.durationSeconds,
        width: original.width,
        height: original.height,
        status: 'ready',
        createdById: caller.userId,
      }).returning()
      const [next] = await tx.update(exercises)
        .set(original.purpose === 'clip' ? { clipId: row!.id } : { posterId: row!.id })
        .where(eq(exercises.id, copy!.id)).returning()
      return { row: row!, next: next! }
    })
    updated = saved.next
    if (original.purpose === 'clip') clip = saved.row
  }
  // The copy's clip says the same things at the same moments.
  if (clip) {
    const cues = await listClipCues(db, caller.teamId, exercise.id)
    if (cues.length) {
      await db.insert(clipCues).values(cues.map(cue => ({ teamId: caller.teamId, exerciseId: copy!.id, startSeconds: cue.startSeconds, endSeconds: cue.endSeconds, text: cue.text, createdById: caller.userId })))
    }
  }
  setResponseStatus(event, 201)
  return { ...exerciseView(updated, clip), mediaCopied }
})
