import { and, count, eq, gte, inArray, notExists } from 'drizzle-orm'
import type { Database } from '../db/client'
import { assignments, blockRoutines, blocks, blockTargets, blockWeekOverrides, routines, sessionLogs, squads } from '../db/schema'
import type { BlockInput } from '#shared/schemas/block'
import { MAX_BATCH_ASSIGNMENTS } from './planner'
import {
  blockAthletes, computeBlockWeeks, firstFutureWeek, loadBlock, overridesOf, slotRoutines, slotsOf,
  teamPlateKg, weekSnapshot, type LoadedBlock, type SlotInput,
} from './block-plan'
import { addDays, todayIn } from '#shared/utils/dates'
import { ruleProblem } from '#shared/utils/progression'

/**
 * Checks a block's input against the team: squads (404 when not the team's), athletes (400),
 * routines (404 / 400 archived), and each rule against its routine over the block's weeks (400 naming the rule).
 */
export async function checkBlockInput(db: Database, teamId: number, input: BlockInput, blockId?: number) {
  if (input.squadIds.length) {
    const found = await db.select({ id: squads.id }).from(squads).where(and(eq(squads.teamId, teamId), inArray(squads.id, input.squadIds)))
    if (found.length !== new Set(input.squadIds).size) notFound('No such squad')
  }
  await assertTeamAthletes(db, teamId, input.athleteIds)
  const routinesById = await slotRoutines(db, teamId, input.routines.map(slot => slot.routineId), (routineId) => {
    const index = input.routines.findIndex(slot => slot.routineId === routineId)
    return `routines.${index}.routineId`
  })
  input.routines.forEach((slot, index) => {
    const routine = routinesById.get(slot.routineId)!
    slot.rules.forEach((rule, ruleIndex) => {
      const problem = ruleProblem(routine.steps, rule, input.weeks)
      if (problem) refuseField(`routines.${index}.rules.${ruleIndex}.${problem.startsWith('This step') ? 'stepId' : rule.cap !== undefined && problem.startsWith('The cap') ? 'cap' : 'by'}`, problem)
    })
  })
  if (blockId !== undefined) {
    const own = await db.select({ id: blockRoutines.id }).from(blockRoutines).where(eq(blockRoutines.blockId, blockId))
    const ownIds = new Set(own.map(row => row.id))
    input.routines.forEach((slot, index) => {
      if (slot.id !== undefined && !ownIds.has(slot.id)) refuseField(`routines.${index}.id`, 'This routine slot is not part of the block')
    })
  }
  return routinesById
}

export function inputSlots(input: BlockInput): SlotInput[] {
  return input.routines.map((slot, index) => ({ key: slot.id ? String(slot.id) : `new-${index}`, slotId: slot.id ?? null, routineId: slot.routineId, weekday: slot.weekday, rules: slot.rules, note: slot.note }))
}

export function blockValues(input: BlockInput) {
  return {
    name: input.name,
    startDate: input.startDate,
    weeks: input.weeks,
    goalRaceName: input.goalRace?.name ?? null,
    goalRaceDate: input.goalRace?.date ?? null,
    goalRaceDistanceM: input.goalRace?.distanceM ?? null,
    lighter: input.lighter,
    taper: input.taper,
    note: input.note,
  }
}

type Tx = Parameters<Parameters<Database['transaction']>[0]>[0]

/** Writes people and routine slots: slots with an id are updated, the others added, the missing ones removed. */
export async function writeBlockParts(tx: Tx, blockId: number, input: BlockInput) {
  await tx.delete(blockTargets).where(eq(blockTargets.blockId, blockId))
  const targets = [
    ...[...new Set(input.athleteIds)].map(athleteId => ({ blockId, athleteId })),
    ...[...new Set(input.squadIds)].map(squadId => ({ blockId, squadId })),
  ]
  if (targets.length) await tx.insert(blockTargets).values(targets)
  const keep = input.routines.flatMap(slot => slot.id ? [slot.id] : [])
  const existing = await tx.select({ id: blockRoutines.id }).from(blockRoutines).where(eq(blockRoutines.blockId, blockId))
  const gone = existing.map(row => row.id).filter(id => !keep.includes(id))
  if (gone.length) await tx.delete(blockRoutines).where(inArray(blockRoutines.id, gone))
  for (const [position, slot] of input.routines.entries()) {
    const values = { routineId: slot.routineId, weekday: slot.weekday, rules: slot.rules, note: slot.note, position }
    if (slot.id) await tx.update(blockRoutines).set(values).where(and(eq(blockRoutines.id, slot.id), eq(blockRoutines.blockId, blockId)))
    else await tx.insert(blockRoutines).values({ blockId, ...values })
  }
}

/** The block as the coach's page shows it: settings, weeks × routines, and where planning stands. */
export async function blockView(db: Database, teamId: number, loaded: LoadedBlock, timezone: string) {
  const { block } = loaded
  const plateKg = await teamPlateKg(db, teamId)
  const routinesById = await slotRoutinesLenient(db, teamId, loaded.routines.map(slot => slot.routineId))
  const weeks = computeBlockWeeks(block, slotsOf(loaded), routinesById, overridesOf(loaded), plateKg)
  const athletes = await blockAthletes(db, teamId, loaded.targets)
  const [sessions] = await db.select({ n: count() }).from(assignments).where(and(eq(assignments.teamId, teamId), eq(assignments.blockId, block.id)))
  const today = todayIn(timezone)
  return {
    block: {
      id: block.id,
      name: block.name,
      startDate: block.startDate,
      weeks: block.weeks,
      endDate: addDays(block.startDate, block.weeks * 7 - 1),
      goalRace: block.goalRaceDate ? { name: block.goalRaceName ?? '', date: block.goalRaceDate, distanceM: block.goalRaceDistanceM ?? 0 } : null,
      lighter: block.lighter,
      taper: block.taper,
      note: block.note,
      athleteIds: loaded.targets.athleteIds,
      squadIds: loaded.targets.squadIds,
      routines: loaded.routines.map(slot => ({ id: slot.id, routineId: slot.routineId, weekday: slot.weekday, rules: slot.rules, note: slot.note, title: routinesById.get(slot.routineId)?.title ?? 'Routine no longer available', steps: routinesById.get(slot.routineId)?.steps ?? [] })),
    },
    overrides: loaded.overrides.map(item => ({ blockRoutineId: item.blockRoutineId, week: item.week, values: item.values })),
    weeks,
    plateKg,
    athletes: athletes.map(athlete => ({ id: athlete.id, name: athlete.name })),
    planning: {
      plannedAt: block.plannedAt,
      sessions: sessions?.n ?? 0,
      upToDate: block.plannedAt !== null && block.plannedRevision === block.revision,
      today,
      /** Where a re-plan would start. */
      nextWeek: block.plannedAt ? firstFutureWeek(block.startDate, block.weeks, today) : 1,
    },
  }
}

/** Like slotRoutines, but a routine archived since the block was made still shows (only planning refuses it). */
async function slotRoutinesLenient(db: Database, teamId: number, ids: number[]) {
  const rows = ids.length ? await db.select().from(routines).where(and(eq(routines.teamId, teamId), inArray(routines.id, [...new Set(ids)]))) : []
  return new Map(rows.map(row => [row.id, { id: row.id, version: row.version, title: row.title, steps: row.steps, snapshot: { title: row.title, category: row.category, description: row.description, steps: row.steps, exercises: [] } }]))
}

export function assertPlanSize(athletes: number, sessionsPerAthlete: number) {
  if (athletes * sessionsPerAthlete > MAX_BATCH_ASSIGNMENTS) {
    refuseField('routines', `That makes ${athletes * sessionsPerAthlete} sessions; a block plans at most ${MAX_BATCH_ASSIGNMENTS} at once`)
  }
}

/**
 * After a week is set by hand: rewrites that week's and the next week's sessions of the slot that are
 * still planned, unlogged and not in the past, so they show the new numbers and "what changed".
 */
export async function applyWeekToSessions(db: Database, teamId: number, blockId: number, slotId: number, week: number, today: string) {
  const loaded = await loadBlock(db, teamId, blockId)
  const slot = loaded.routines.find(item => item.id === slotId)
  if (!slot) return 0
  const plateKg = await teamPlateKg(db, teamId)
  const routinesById = await slotRoutines(db, teamId, [slot.routineId], () => 'blockRoutineId')
  const weeks = computeBlockWeeks(loaded.block, slotsOf(loaded).filter(item => item.slotId === slotId), routinesById, overridesOf(loaded), plateKg)
  let updated = 0
  await db.transaction(async (tx) => {
    for (const planned of weeks.filter(item => item.week === week || item.week === week + 1)) {
      const cell = planned.cells[0]
      if (!cell) continue
      const result = await tx.update(assignments)
        .set({ snapshot: weekSnapshot(routinesById.get(slot.routineId)!, loaded.block, planned, cell) })
        .where(and(
          eq(assignments.teamId, teamId),
          eq(assignments.blockId, blockId),
          eq(assignments.blockRoutineId, slotId),
          eq(assignments.blockWeek, planned.week),
          eq(assignments.status, 'planned'),
          gte(assignments.date, today),
          notExists(tx.select({ id: sessionLogs.id }).from(sessionLogs).where(eq(sessionLogs.assignmentId, assignments.id))),
        ))
        .returning({ id: assignments.id })
      updated += result.length
    }
  })
  return updated
}

export async function saveWeekOverride(db: Database, blockId: number, slotId: number, week: number, values: { stepId: string, field: string, value: number }[]) {
  await db.transaction(async (tx) => {
    await tx.delete(blockWeekOverrides).where(and(eq(blockWeekOverrides.blockRoutineId, slotId), eq(blockWeekOverrides.week, week)))
    if (values.length) await tx.insert(blockWeekOverrides).values({ blockId, blockRoutineId: slotId, week, values: values as never })
    // The hand-set week reaches its sessions straight away, so a block that was up to date stays so.
    const [current] = await tx.select({ revision: blocks.revision, plannedRevision: blocks.plannedRevision }).from(blocks).where(eq(blocks.id, blockId))
    const revision = (current?.revision ?? 1) + 1
    await tx.update(blocks).set({ revision, ...(current?.plannedRevision === current?.revision ? { plannedRevision: revision } : {}) }).where(eq(blocks.id, blockId))
  })
}
