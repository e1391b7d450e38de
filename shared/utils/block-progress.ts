// Planned against done per week of a training block: plain sums, shared by the coach's chart and its tests.

export interface ProgressRow {
  athleteId: number
  athleteName: string
  week: number
  plannedMin: number
  doneMin: number
  done: boolean
}

export interface ProgressWeek {
  week: number
  plannedMin: number
  doneMin: number
  plannedSessions: number
  doneSessions: number
}

export interface ProgressSeries {
  key: string
  label: string
  /** Squads and everyone are per athlete (the mean of their athletes), so a squad of 3 and one of 12 compare. */
  perAthlete: boolean
  weeks: ProgressWeek[]
}

function sumWeeks(rows: readonly ProgressRow[], weeks: number, divideBy = 1): ProgressWeek[] {
  return Array.from({ length: weeks }, (_, index) => {
    const week = index + 1
    const inWeek = rows.filter(row => row.week === week)
    const round = (value: number) => Math.round(value / Math.max(1, divideBy) * 10) / 10
    return {
      week,
      plannedMin: round(inWeek.reduce((sum, row) => sum + row.plannedMin, 0)),
      doneMin: round(inWeek.reduce((sum, row) => sum + row.doneMin, 0)),
      plannedSessions: inWeek.length,
      doneSessions: inWeek.filter(row => row.done).length,
    }
  })
}

export function blockProgressSeries(rows: readonly ProgressRow[], weeks: number, squads: readonly { id: number, name: string, athleteIds: number[] }[]): ProgressSeries[] {
  const athletes = [...new Map(rows.map(row => [row.athleteId, row.athleteName])).entries()].sort((a, b) => a[1].localeCompare(b[1]))
  const series: ProgressSeries[] = [{ key: 'all', label: 'Everyone', perAthlete: true, weeks: sumWeeks(rows, weeks, athletes.length) }]
  for (const squad of squads) {
    const inSquad = rows.filter(row => squad.athleteIds.includes(row.athleteId))
    const count = new Set(inSquad.map(row => row.athleteId)).size
    series.push({ key: `squad-${squad.id}`, label: `${squad.name} (squad)`, perAthlete: true, weeks: sumWeeks(inSquad, weeks, count) })
  }
  for (const [athleteId, name] of athletes) {
    series.push({ key: `athlete-${athleteId}`, label: name, perAthlete: false, weeks: sumWeeks(rows.filter(row => row.athleteId === athleteId), weeks) })
  }
  return series
}
