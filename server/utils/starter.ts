import { and, eq, isNotNull, isNull } from 'drizzle-orm'
import type { Database } from '../db/client'
import { exercises, mediaObjects, routines } from '../db/schema'
import { starterExercises, starterSlug } from '../starter/exercises'
import { starterTemplates } from '../starter/routines'
import { routineStepsSchema } from '#shared/schemas/routine-steps'

export interface StarterSetResult {
  exercisesAdded: number
  routinesAdded: number
  clipsCopied: number
  /** Clips that could not be copied (the store was unreachable); adding the set again retries them. */
  clipsMissing: number
}

/** The demo clip shipped with the app for a starter exercise (server/assets/starter-clips). */
async function starterClip(slug: string): Promise<Uint8Array | null> {
  const raw = await useStorage('assets:server').getItemRaw(`starter-clips:${slug}.webm`)
  if (!raw) return null
  return raw instanceof Uint8Array ? raw : new Uint8Array(raw as ArrayBuffer)
}

/**
 * Copies the starter library, its demo clips and the starter routines into a team. Idempotent: each
 * copy carries a `starter_key` unique within the team, so adding the set again adds only what is
 * missing (and retries clips an earlier run could not copy). The copies are the team's own to edit.
 */
export async function addStarterSet(db: Database, teamId: number, userId: number): Promise<StarterSetResult> {
  let exercisesAdded = 0
  for (const { clip: _clip, ...exercise } of starterExercises) {
    const inserted = await db.insert(exercises).values({ ...exercise, teamId, starterKey: starterSlug(exercise.name), createdById: userId })
      .onConflictDoNothing().returning({ id: exercises.id })
    exercisesAdded += inserted.length
  }

  const copies = await db.select({ id: exercises.id, starterKey: exercises.starterKey, name: exercises.name }).from(exercises)
    .where(and(eq(exercises.teamId, teamId), isNotNull(exercises.starterKey)))
  const byKey = new Map(copies.map(row => [row.starterKey!, row.id]))

  let clipsCopied = 0
  let clipsMissing = 0
  const withoutClip = await db.select({ id: exercises.id, starterKey: exercises.starterKey }).from(exercises)
    .where(and(eq(exercises.teamId, teamId), isNotNull(exercises.starterKey), isNull(exercises.clipId), isNull(exercises.archivedAt)))
  const wanted = new Set(starterExercises.filter(exercise => exercise.clip).map(exercise => starterSlug(exercise.name)))
  for (const row of withoutClip) {
    if (!wanted.has(row.starterKey!)) continue
    const body = await starterClip(row.starterKey!)
    if (!body) {
      clipsMissing += 1
      continue
    }
    const key = newExerciseKey(teamId, row.id, 'video/webm')
    try {
      await putObject(key, body, 'video/webm')
    }
    catch {
      clipsMissing += 1
      continue
    }
    await db.transaction(async (tx) => {
      const [media] = await tx.insert(mediaObjects).values({ teamId, exerciseId: row.id, key, purpose: 'clip', contentType: 'video/webm', size: body.byteLength, status: 'ready', createdById: userId })
        .returning({ id: mediaObjects.id })
      await tx.update(exercises).set({ clipId: media!.id }).where(and(eq(exercises.id, row.id), isNull(exercises.clipId)))
    })
    clipsCopied += 1
  }

  let routinesAdded = 0
  const exerciseId = (name: string) => byKey.get(starterSlug(name))
  for (const template of starterTemplates) {
    if (template.needs.some(name => !exerciseId(name))) continue
    // Stored as the schema returns it (no `undefined` keys), like a routine saved from the builder.
    const steps = routineStepsSchema.parse(JSON.parse(JSON.stringify(template.steps(exerciseId))))
    await db.transaction(async (tx) => {
      const [routine] = await tx.insert(routines).values({
        teamId,
        title: template.title.replace(/^Template: /, ''),
        category: template.category,
        description: template.description,
        steps,
        starterKey: starterSlug(template.title),
        createdById: userId,
      }).onConflictDoNothing().returning({ id: routines.id })
      if (!routine) return
      await writeRoutineExercises(tx, routine.id, steps)
      routinesAdded += 1
    })
  }
  return { exercisesAdded, routinesAdded, clipsCopied, clipsMissing }
}
