import { and, eq, sql, type SQL } from 'drizzle-orm'
import type { SQLiteColumn } from 'drizzle-orm/sqlite-core'
import type { Database } from '../db/client'
import { anonymisedMembers, users } from '../db/schema'

type Writer = Pick<Database, 'select' | 'insert'>

export const FORMER_ATHLETE_LABEL = 'Former athlete'

/**
 * The athlete's name as the team sees it in its history: their name, or "Former athlete N" once they were
 * removed with their records anonymised (and have not come back; a member is always shown by name).
 * The query must join `users` on the athlete.
 */
export function shownAthleteName(teamId: number, athleteId: SQLiteColumn | SQL): SQL<string> {
  return sql<string>`coalesce((
    select ${FORMER_ATHLETE_LABEL} || ' ' || "former"."number" from "anonymised_members" as "former"
    where "former"."team_id" = ${teamId} and "former"."user_id" = ${athleteId}
      and not exists (select 1 from "memberships" as "member" where "member"."team_id" = ${teamId} and "member"."user_id" = ${athleteId})
  ), ${users.name})`
}

/** Whether the athlete no longer belongs to the team (their history is still the team's). */
export function isFormerMember(teamId: number, athleteId: SQLiteColumn | SQL): SQL<boolean> {
  return sql<boolean>`not exists (select 1 from "memberships" as "member" where "member"."team_id" = ${teamId} and "member"."user_id" = ${athleteId})`
}

/** Gives a removed athlete their label in this team: the next free number, kept if they had one already. */
export async function labelFormerAthlete(tx: Writer, teamId: number, userId: number) {
  const [existing] = await tx.select({ number: anonymisedMembers.number }).from(anonymisedMembers)
    .where(and(eq(anonymisedMembers.teamId, teamId), eq(anonymisedMembers.userId, userId))).limit(1)
  if (existing) return existing.number
  const [next] = await tx.select({ number: sql<number>`coalesce(max(${anonymisedMembers.number}), 0) + 1` }).from(anonymisedMembers)
    .where(eq(anonymisedMembers.teamId, teamId))
  const number = Number(next?.number ?? 1)
  await tx.insert(anonymisedMembers).values({ teamId, userId, number })
  return number
}
