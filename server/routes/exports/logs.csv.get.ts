import Papa from 'papaparse'
import { exportLogsQuerySchema } from '#shared/schemas/insights'
import { addDays, daysBetween, startOfWeek, todayIn } from '#shared/utils/dates'
import { RATIO_LOOKBACK_DAYS, weeklyLoads } from '#shared/utils/insights'
import { bodyAreas } from '#shared/utils/vocabulary'

const MAX_RANGE_DAYS = 3 * 366

/**
 * Session logs (or weekly loads with the ratios) as CSV. Coaches export their team or one athlete of it;
 * an athlete exports only their own. The numbers go through the same rounding as the screens.
 */
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event, 'athlete')
  const query = queryWith(event, exportLogsQuerySchema)
  const coach = isCoachRole(caller.role)
  if (!coach && query.athleteId && query.athleteId !== caller.userId) notFound('No such athlete')
  const to = query.to ?? todayIn(caller.timezone)
  const from = query.from ?? addDays(to, -89)
  if (daysBetween(from, to) < 0) {
    refuseField('from', 'The start date must be on or before the end date')
  }
  if (daysBetween(from, to) >= MAX_RANGE_DAYS) {
    refuseField('from', 'Export at most three years at a time')
  }
  const db = await useDb()
  const athleteId = coach ? query.athleteId : caller.userId
  // A team export keeps the history of athletes who have left (under "Former athlete N" when anonymised).
  const athletes = athleteId
    ? (await listTeamAthletes(db, caller.teamId)).filter(athlete => athlete.id === athleteId)
    : [...await listTeamAthletes(db, caller.teamId), ...await listFormerAthletes(db, caller.teamId)]
  if (athleteId && !athletes.length) notFound('No such athlete')
  const ids = athletes.map(athlete => athlete.id)

  let csv: string
  if (query.kind === 'weeks') {
    const loads = await dailyLoadsByAthlete(db, caller.teamId, addDays(startOfWeek(from), -(RATIO_LOOKBACK_DAYS - 1)), to, ids)
    const rows = athletes.flatMap((athlete) => {
      const athleteToday = todayIn(athlete.timezone)
      const end = to < athleteToday ? to : athleteToday
      if (end < from) return []
      return weeklyLoads(loads.get(athlete.id) ?? [], athlete.firstDay, from, end).map(week => [
        athlete.name, week.weekStart, week.sessions, week.load, week.acwrRolling ?? '', week.acwrEwma ?? '',
      ])
    })
    csv = Papa.unparse({ fields: ['athlete', 'week_start', 'sessions', 'load', 'ratio_rolling', 'ratio_ewma'], data: rows }, { escapeFormulae: true })
  }
  else {
    const rows = await sessionRows(db, caller.teamId, { athleteIds: ids, from, to })
    csv = Papa.unparse({
      fields: ['athlete', 'session_id', 'date', 'routine', 'duration_min', 'session_rpe', 'load', 'pain', 'pain_area', 'note'],
      data: rows.map(row => [row.athleteName, row.id, row.day, row.routine, row.durationMin ?? '', row.sessionRpe ?? '', row.load ?? '', row.pain ?? '', bodyAreas.label(row.painArea), row.note]),
    }, { escapeFormulae: true })
  }
  const who = athleteId ? `athlete-${athleteId}` : 'team'
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="switchback-${query.kind}-${who}-${from}-to-${to}.csv"`)
  setResponseHeader(event, 'cache-control', 'private, no-store')
  return csv
})
