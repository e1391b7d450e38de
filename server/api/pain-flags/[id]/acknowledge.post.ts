import { and, eq } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { acknowledgePainFlagSchema } from '#shared/schemas/insights'
import { memberships, painFlags, users } from '../../../db/schema'

/** Marks a flag as seen, with an optional reply the athlete reads on their progress page. Repeating it updates the reply. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const { reply } = await readBodyWith(event, acknowledgePainFlagSchema)
  const db = await useDb()
  await db.transaction(async (tx) => {
    const [updated] = await tx.update(painFlags)
      .set({ status: 'acknowledged', reply: reply || null, acknowledgedById: caller.userId, acknowledgedAt: new Date() })
      .where(and(eq(painFlags.id, id), eq(painFlags.teamId, caller.teamId)))
      .returning({ athleteId: painFlags.athleteId, area: painFlags.area, pain: painFlags.pain })
    if (!updated) notFound('No such pain flag')
    // A reply is worth a message of its own: the athlete may not open the app before their next session.
    // Someone who has left the team gets nothing from it.
    if (reply) {
      const [athlete] = await tx.select({ email: users.email }).from(users)
        .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.teamId, caller.teamId)))
        .where(eq(users.id, updated.athleteId)).limit(1)
      if (athlete) {
        await enqueueEmail(tx, {
          to: athlete.email,
          template: 'pain_flag_reply',
          teamId: caller.teamId,
          payload: { coachName: caller.name, reply, area: updated.area ?? '', pain: updated.pain, url: `${useServerConfig().appUrl}/progress` },
        })
      }
    }
  })
  const [flag] = await listPainFlags(db, caller.teamId, { id })
  return flag
})
