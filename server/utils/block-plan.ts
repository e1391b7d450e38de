import { and, asc, eq, gte, inArray, notExists } from 'drizzle-orm'
import type { Database } from '../db/client'
import { assignments, blockRoutines, blocks, blockTargets, blockWeekOverrides, memberships, sessionLogs, squadMembers, teams, users } from '../db/schema'
import { snapshotRoutine } from './snapshot'
import { notFound } from './validation'
import type { AssignmentSnapshot } from '#shared/types/domain'
import { addDays, weekdayOf } from '#shared/utils/dates'
import {
  describeChanges, keyNumbers, planWeek, volumeFactor, weekKind, weekOfBlock,
  type BlockShape, type FieldOverride, type KeyNumbers, type WeekKind,
} from '#shared/utils/progression'
import type { RoutineStep } from '#shared/schemas/routine-steps'

// Training blocks: loading one, working out every week's sessions, writing them. Explicit imports
// (no Nitro auto-imports) so the demo seed can plan a block with the same code.

type Reader = Pick<Database, 'select'>
type Writer = Pick<Database, 'insert' | 'select' | 'update' | 'delete'>

export type BlockRow = typeof blocks.$inferSelect
export type BlockRoutineRow = typeof blockRoutines.$inferSelect

export interface LoadedBlock {
  block: BlockRow
  routines: BlockRoutineRow[]
  targets: { athleteIds: number[], squadIds: number[] }
  overrides: (typeof blockWeekOverrides.$inferSelect)[]
}

export function blockNotFound(): never {
  notFound('No such block')
}

/** The block with its routine slots, people and hand-set weeks; 404 for another team's block. */
export async function loadBlock(db: Reader, teamId: number, id: number): Promise<LoadedBlock> {
  const [block] = await db.select().from(blocks).where(and(eq(blocks.id, id), eq(blocks.teamId, teamId))).limit(1)
  if (!block) blockNotFound()
  const [slots, targets, overrides] = await Promise.all([
    db.select().from(blockRoutines).where(eq(blockRoutines.blockId, id)).orderBy(asc(blockRoutines.weekday), asc(blockRoutines.position)),
    db.select().from(blockTargets).where(eq(blockTargets.blockId, id)),
    db.select().from(blockWeekOverrides).where(eq(blockWeekOverrides.blockId, id)),
  ])
  return {
    block,
    routines: slots,
    targets: {
      athleteIds: targets.flatMap(target => target.athleteId ? [target.athleteId] : []),
      squadIds: targets.flatMap(target => target.squadId ? [target.squadId] : []),
    },
    overrides,
  }
}

export function blockShape(block: Pick<BlockRow, 'startDate' | 'weeks' | 'lighter' | 'taper' | 'goalRaceDate'>): BlockShape {
  return {
    weeks: block.weeks,
    lighter: block.lighter ?? null,
    taper: block.taper ?? null,
    raceWeek: block.goalRaceDate ? weekOfBlock(block.startDate, block.weeks, block.goalRaceDate) : null,
  }
}

/** The day of week `week` (from 1) that falls on `weekday` (1 = Monday). */
export function dayInWeek(startDate: string, week: number, weekday: number): string {
  const first = addDays(startDate, (week - 1) * 7)
  return addDays(first, (weekday - weekdayOf(first) + 7) % 7)
}

export interface SlotInput {
  key: string
  slotId: number | null
  routineId: number
  weekday: number
  rules: BlockRoutineRow['rules']
  note: string
}

export interface SlotRoutine {
  id: number
  version: number
  title: string
  steps: RoutineStep[]
  snapshot: AssignmentSnapshot
}

export interface PlannedCell {
  slotKey: string
  slotId: number | null
  routineId: number
  title: string
  date: string
  steps: RoutineStep[]
  numbers: KeyNumbers
  changes: string[]
  overridden: boolean
}

export interface PlannedBlockWeek {
  week: number
  startDate: string
  kind: WeekKind
  factor: number
  cells: PlannedCell[]
  /** Planned minutes and lifting kilos of one athlete's week. */
  volumeMin: number
  tonnageKg: number
}

/** Every week of the block for one athlete: each slot's steps, key numbers and what changed from the week before. */
export function computeBlockWeeks(
  block: Pick<BlockRow, 'startDate' | 'weeks' | 'lighter' | 'taper' | 'goalRaceDate'>,
  slots: readonly SlotInput[],
  routinesById: ReadonlyMap<number, SlotRoutine>,
  overrides: readonly { slotId: number, week: number, values: FieldOverride[] }[],
  plateKg: number,
): PlannedBlockWeek[] {
  const shape = blockShape(block)
  const previous = new Map<string, RoutineStep[]>()
  const weeks: PlannedBlockWeek[] = []
  for (let week = 1; week <= block.weeks; week++) {
    const cells: PlannedCell[] = []
    for (const slot of slots) {
      const routine = routinesById.get(slot.routineId)
      if (!routine) continue
      const hand = slot.slotId ? overrides.find(item => item.slotId === slot.slotId && item.week === week)?.values : undefined
      const planned = planWeek(routine.steps, week, { rules: slot.rules, shape, plateKg, overrides: hand })
      const before = previous.get(slot.key)
      cells.push({
        slotKey: slot.key,
        slotId: slot.slotId,
        routineId: routine.id,
        title: routine.title,
        date: dayInWeek(block.startDate, week, slot.weekday),
        steps: planned.steps,
        numbers: keyNumbers(planned.steps),
        changes: before ? describeChanges(before, planned.steps) : [],
        overridden: planned.overridden,
      })
      previous.set(slot.key, planned.steps)
    }
    weeks.push({
      week,
      startDate: addDays(block.startDate, (week - 1) * 7),
      kind: weekKind(week, shape),
      factor: volumeFactor(week, shape),
      cells,
      volumeMin: Math.round(cells.reduce((sum, cell) => sum + cell.numbers.durationS, 0) / 60),
      tonnageKg: cells.reduce((sum, cell) => sum + cell.numbers.tonnageKg, 0),
    })
  }
  return weeks
}

/** Snapshots of every routine the slots use, as they are now (404 for another team's, 400 for an archived one). */
export async function slotRoutines(db: Reader, teamId: number, routineIds: number[], fieldOf: (routineId: number) => string) {
  const byId = new Map<number, SlotRoutine>()
  for (const routineId of [...new Set(routineIds)]) {
    const { routine, snapshot } = await snapshotRoutine(db, teamId, routineId, fieldOf(routineId))
    byId.set(routineId, { id: routine.id, version: routine.version, title: routine.title, steps: routine.steps, snapshot })
  }
  return byId
}

export async function teamPlateKg(db: Reader, teamId: number): Promise<number> {
  const [team] = await db.select({ plateIncrementKg: teams.plateIncrementKg }).from(teams).where(eq(teams.id, teamId)).limit(1)
  return team?.plateIncrementKg ?? 2.5
}

export function slotsOf(loaded: LoadedBlock): SlotInput[] {
  return loaded.routines.map(slot => ({ key: String(slot.id), slotId: slot.id, routineId: slot.routineId, weekday: slot.weekday, rules: slot.rules, note: slot.note }))
}

export function overridesOf(loaded: LoadedBlock) {
  return loaded.overrides.map(item => ({ slotId: item.blockRoutineId, week: item.week, values: item.values }))
}

export interface BlockAthlete {
  id: number
  name: string
  email: string
  notifyByEmail: boolean
  timezone: string
}

/** The block's athletes now: those named, and the athletes currently in its squads. */
export async function blockAthletes(db: Reader, teamId: number, targets: LoadedBlock['targets']): Promise<BlockAthlete[]> {
  const ids = new Set(targets.athleteIds)
  if (targets.squadIds.length) {
    const members = await db.select({ id: squadMembers.userId }).from(squadMembers).where(inArray(squadMembers.squadId, targets.squadIds))
    members.forEach(member => ids.add(member.id))
  }
  if (!ids.size) return []
  return db.select({ id: users.id, name: users.name, email: users.email, notifyByEmail: users.notifyByEmail, timezone: users.timezone })
    .from(users)
    .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.teamId, teamId), eq(memberships.role, 'athlete')))
    .where(inArray(users.id, [...ids]))
    .orderBy(asc(users.name))
}

/** The first week that has not started by `today`; re-planning touches only this week and later. */
export function firstFutureWeek(startDate: string, weeks: number, today: string): number {
  for (let week = 1; week <= weeks; week++) {
    if (addDays(startDate, (week - 1) * 7) > today) return week
  }
  return weeks + 1
}

export function weekSnapshot(routine: SlotRoutine, block: Pick<BlockRow, 'id' | 'name' | 'weeks'>, week: PlannedBlockWeek, cell: PlannedCell): AssignmentSnapshot {
  return {
    ...routine.snapshot,
    steps: cell.steps,
    block: { id: block.id, name: block.name, week: week.week, weeks: block.weeks, kind: week.kind, changes: cell.changes, overridden: cell.overridden },
  }
}

export interface WritePlanResult {
  created: number
  removed: number
  fromWeek: number
  /** Each athlete's new days, for the notices. */
  datesByAthlete: Map<number, string[]>
}

const INSERT_CHUNK = 100

/**
 * Writes the block's sessions from `fromWeek` on, inside the caller's transaction: planned sessions
 * with no log from that week on are removed and written again with their own week's snapshot;
 * a session with a log stays, and its slot and week are not written twice.
 */
export async function writeBlockPlan(tx: Writer, input: {
  teamId: number
  coachId: number
  loaded: LoadedBlock
  athletes: BlockAthlete[]
  weeks: PlannedBlockWeek[]
  routinesById: ReadonlyMap<number, SlotRoutine>
  fromWeek: number
}): Promise<WritePlanResult> {
  const { block } = input.loaded
  const stale = await tx.select({ id: assignments.id }).from(assignments)
    .where(and(
      eq(assignments.teamId, input.teamId),
      eq(assignments.blockId, block.id),
      gte(assignments.blockWeek, input.fromWeek),
      eq(assignments.status, 'planned'),
      notExists(tx.select({ id: sessionLogs.id }).from(sessionLogs).where(eq(sessionLogs.assignmentId, assignments.id))),
    ))
  const staleIds = stale.map(row => row.id)
  for (let start = 0; start < staleIds.length; start += 500) {
    await tx.delete(assignments).where(inArray(assignments.id, staleIds.slice(start, start + 500)))
  }
  const kept = await tx.select({ athleteId: assignments.athleteId, slotId: assignments.blockRoutineId, week: assignments.blockWeek }).from(assignments)
    .where(and(eq(assignments.teamId, input.teamId), eq(assignments.blockId, block.id), gte(assignments.blockWeek, input.fromWeek)))
  const keptKeys = new Set(kept.map(row => `${row.athleteId}:${row.slotId}:${row.week}`))

  // The first re-planned week says what changed from the week before as it was planned, not as the new rules would have it.
  const previousWeek = input.fromWeek > 1
    ? await tx.select({ athleteId: assignments.athleteId, slotId: assignments.blockRoutineId, snapshot: assignments.snapshot }).from(assignments)
        .where(and(eq(assignments.teamId, input.teamId), eq(assignments.blockId, block.id), eq(assignments.blockWeek, input.fromWeek - 1)))
    : []
  const before = new Map(previousWeek.map(row => [`${row.athleteId}:${row.slotId}`, row.snapshot.steps]))

  const note = block.note
  const rows: (typeof assignments.$inferInsert)[] = []
  const datesByAthlete = new Map<number, string[]>()
  for (const athlete of input.athletes) {
    for (const week of input.weeks) {
      if (week.week < input.fromWeek) continue
      for (const cell of week.cells) {
        if (keptKeys.has(`${athlete.id}:${cell.slotId}:${week.week}`)) continue
        const routine = input.routinesById.get(cell.routineId)!
        const earlier = week.week === input.fromWeek ? before.get(`${athlete.id}:${cell.slotId}`) : undefined
        const planned = earlier ? { ...cell, changes: describeChanges(earlier, cell.steps) } : cell
        const slotNote = input.loaded.routines.find(slot => slot.id === cell.slotId)?.note ?? ''
        rows.push({
          teamId: input.teamId,
          athleteId: athlete.id,
          routineId: routine.id,
          routineVersion: routine.version,
          snapshot: weekSnapshot(routine, block, week, planned),
          date: cell.date,
          note: [note, slotNote].filter(Boolean).join('\n\n'),
          assignedById: input.coachId,
          blockId: block.id,
          blockWeek: week.week,
          blockRoutineId: cell.slotId,
        })
        datesByAthlete.set(athlete.id, [...(datesByAthlete.get(athlete.id) ?? []), cell.date])
      }
    }
  }
  for (let start = 0; start < rows.length; start += INSERT_CHUNK) {
    await tx.insert(assignments).values(rows.slice(start, start + INSERT_CHUNK))
  }
  return { created: rows.length, removed: staleIds.length, fromWeek: input.fromWeek, datesByAthlete }
}
