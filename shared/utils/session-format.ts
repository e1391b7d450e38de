import { bodyAreas, effortWords, plural } from './vocabulary'
import { formatPace, type PaceUnit } from './pace'
import type { PlanSegment } from './session-plan'

const zoneLabels: Record<string, string> = { easy: 'Easy', marathon: 'Marathon pace', threshold: 'Threshold', tenK: '10K pace', fiveK: '5K pace', mile: 'Mile pace' }

/** 75 000 ms → '1:15'; 3 723 000 ms → '1:02:03'. Rounds up, so a countdown shows 0:01 until it ends. */
export function clockText(ms: number, roundUp = true) {
  const total = Math.max(0, roundUp ? Math.ceil(ms / 1000) : Math.floor(ms / 1000))
  const hours = Math.floor(total / 3600)
  const minutes = Math.floor((total % 3600) / 60)
  const seconds = String(total % 60).padStart(2, '0')
  return hours ? `${hours}:${String(minutes).padStart(2, '0')}:${seconds}` : `${minutes}:${seconds}`
}

export function minutesText(seconds: number) {
  const minutes = Math.round(seconds / 60)
  return minutes < 60 ? `${minutes} min` : `${Math.floor(minutes / 60)} h ${minutes % 60} min`
}

/** How much of it: '8 reps', '200 m', '0:30'. */
export function amountText(segment: PlanSegment, units: PaceUnit = 'km') {
  if (segment.measure === 'reps') return plural(segment.reps ?? 0, 'rep')
  if (segment.measure === 'distance' && segment.meters) {
    return units === 'mi' && segment.meters >= 800 ? `${(segment.meters / 1609.344).toFixed(2)} mi` : `${segment.meters} m`
  }
  return clockText(segment.durationS * 1000)
}

/** What to aim for: pace (grade-adjusted on a hill), load, or effort. */
export function targetText(segment: PlanSegment, units: PaceUnit = 'km') {
  const parts: string[] = []
  if (segment.targetZone) {
    const zone = zoneLabels[segment.targetZone] ?? segment.targetZone
    parts.push(segment.targetPaceSPerKm ? `${zone}: ${formatPace(segment.targetPaceSPerKm, units)}` : zone)
  }
  if (segment.grade) parts.push(`${segment.grade > 0 ? 'uphill' : 'downhill'} ${Math.round(Math.abs(segment.grade) * 100)} %${segment.targetPaceSPerKm ? ', pace adjusted for the slope' : ''}`)
  if (segment.targetKg !== null) parts.push(segment.percent1rm ? `${segment.targetKg} kg (${segment.percent1rm} % of your 1RM)` : `${segment.targetKg} kg`)
  else if (segment.percent1rm) parts.push(`${segment.percent1rm} % of your 1RM — pick a load you can control`)
  if (segment.targetRpe !== null) parts.push(`Effort ${segment.targetRpe} of 10: ${effortWords(segment.targetRpe).toLowerCase()}`)
  return parts.join(' · ')
}

/** 'Set 2 of 3 · Round 1 of 6'. */
export function positionText(segment: PlanSegment) {
  const parts: string[] = []
  if (segment.set && segment.sets) parts.push(`Set ${segment.set} of ${segment.sets}`)
  if (segment.round && segment.rounds) parts.push(`Round ${segment.round} of ${segment.rounds}`)
  return parts.join(' · ')
}

export function areaLabel(area: string | null | undefined) {
  return bodyAreas.label(area)
}
