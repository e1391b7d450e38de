import { checkNumber } from './numbers'

// Paces are seconds per kilometre, distances metres, times seconds, grades a fraction (0.08 = 8 %).

/** International yard and pound agreement (1959): 1 yd = 0.9144 m, so 1 mi = 1760 yd = 1609.344 m. */
export const MILE_M = 1609.344
export const MARATHON_M = 42_195

/** Race distances offered for a benchmark result: the short name (profile) and the spelled-out one (first visit). */
export const benchmarkDistances = [
  { meters: 5000, short: '5K', spelled: '5 km' },
  { meters: 10_000, short: '10K', spelled: '10 km' },
  { meters: 21_097.5, short: 'Half marathon', spelled: 'Half marathon' },
  { meters: MARATHON_M, short: 'Marathon', spelled: 'Marathon' },
  { meters: MILE_M, short: 'Mile', spelled: '1 mile' },
] as const

const MAX_DURATION_S = 1000 * 3600
const MAX_DISTANCE_M = 1_000_000
// Six hours a kilometre: slower than a steep hike, so anything above is a typo.
const MAX_PACE_S_PER_KM = 6 * 3600
// Faster than any human over 400 m or more; a guard against typos like 4:00 for a 10K.
const MAX_RACE_SPEED_M_PER_MIN = 600

export type PaceUnit = 'km' | 'mi'

export interface TrainingPaces {
  easy: { fast: number, slow: number }
  marathon: number
  threshold: number
  tenK: number
  fiveK: number
  mile: number
}

export interface RaceResult {
  distanceM: number
  timeS: number
}

/** '1:23:45' (h:mm:ss), '40:00' (m:ss) or '45' (s); the last part may have decimals ('4:05.5'). */
export function parseDuration(text: string): number {
  if (typeof text !== 'string') {
    throw new TypeError('A duration must be text such as 1:23:45, 40:00 or 45')
  }
  const trimmed = text.trim()
  const match = /^(\d{1,3})(?::(\d{2}))?(?::(\d{2}))?(\.\d+)?$/.exec(trimmed)
  if (!match) {
    throw new RangeError(`"${text}" is not a duration; write it as h:mm:ss, m:ss or seconds, e.g. 1:23:45, 40:00 or 45`)
  }
  const parts = [match[1], match[2], match[3]].filter((part): part is string => part !== undefined).map(Number)
  const fraction = match[4] ? Number(match[4]) : 0
  for (const part of parts.slice(1)) {
    if (part >= 60) {
      throw new RangeError(`"${text}" is not a duration: minutes and seconds after a colon must be below 60`)
    }
  }
  const seconds = parts.reduce((total, part) => total * 60 + part, 0) + fraction
  if (seconds > MAX_DURATION_S) {
    throw new RangeError(`"${text}" is longer than ${MAX_DURATION_S / 3600} hours`)
  }
  return seconds
}

/** Whole seconds, rounded: '1:23:45', '40:00', '0:45'. */
export function formatDuration(seconds: number): string {
  checkNumber('Duration (s)', seconds, 0, MAX_DURATION_S)
  const whole = Math.round(seconds)
  const hours = Math.floor(whole / 3600)
  const minutes = Math.floor((whole % 3600) / 60)
  const secs = whole % 60
  const pad = (value: number) => String(value).padStart(2, '0')
  return hours > 0 ? `${hours}:${pad(minutes)}:${pad(secs)}` : `${minutes}:${pad(secs)}`
}

/** '4:00 /km' or, for the same pace, '6:26 /mi'. */
export function formatPace(secPerKm: number, unit: PaceUnit = 'km'): string {
  checkNumber('Pace (s/km)', secPerKm, 0, MAX_PACE_S_PER_KM, { exclusiveMin: true })
  if (unit !== 'km' && unit !== 'mi') {
    throw new RangeError(`Pace unit must be 'km' or 'mi' (got ${String(unit)})`)
  }
  const perUnit = unit === 'km' ? secPerKm : kmPaceToMilePace(secPerKm)
  return `${formatDuration(perUnit)} /${unit}`
}

/** A pace range such as easy running, fastest first; one pace when both ends round alike. */
export function formatPaceRange(range: { fast: number, slow: number }, unit: PaceUnit = 'km'): string {
  const fast = formatPace(range.fast, unit)
  const slow = formatPace(range.slow, unit)
  return fast === slow ? fast : `${fast} – ${slow}`
}

export function paceFromRace(distanceM: number, timeS: number): number {
  checkDistance(distanceM)
  checkTime(timeS)
  return timeS / (distanceM / 1000)
}

export function kmPaceToMilePace(secPerKm: number): number {
  checkNumber('Pace (s/km)', secPerKm, 0, MAX_PACE_S_PER_KM, { exclusiveMin: true })
  return secPerKm * MILE_M / 1000
}

export function milePaceToKmPace(secPerMile: number): number {
  checkNumber('Pace (s/mi)', secPerMile, 0, MAX_PACE_S_PER_KM * MILE_M / 1000, { exclusiveMin: true })
  return secPerMile * 1000 / MILE_M
}

/** Riegel (1981), "Athletic records and human endurance", American Scientist 69:285–290: T2 = T1·(D2/D1)^1.06. */
export function riegel(distanceM: number, timeS: number, targetDistanceM: number, exponent = 1.06): number {
  checkDistance(distanceM)
  checkTime(timeS)
  checkDistance(targetDistanceM, 'Target distance (m)')
  checkNumber('Riegel exponent', exponent, 1, 1.2)
  return timeS * (targetDistanceM / distanceM) ** exponent
}

/** Daniels & Gilbert (1979), "Oxygen Power": oxygen cost of running, ml·kg⁻¹·min⁻¹ at v m/min. */
function oxygenCost(metersPerMinute: number): number {
  return -4.60 + 0.182258 * metersPerMinute + 0.000104 * metersPerMinute ** 2
}

/** Daniels & Gilbert (1979), "Oxygen Power": fraction of VO2max sustainable for t minutes. */
function fractionSustained(minutes: number): number {
  return 0.8 + 0.1894393 * Math.exp(-0.012778 * minutes) + 0.2989558 * Math.exp(-0.1932605 * minutes)
}

/** The speed (m/min) whose oxygen cost is `vo2` — the positive root of the Daniels & Gilbert (1979) quadratic. */
function speedForOxygenCost(vo2: number): number {
  const a = 0.000104
  const b = 0.182258
  const c = -4.60 - vo2
  return (-b + Math.sqrt(b * b - 4 * a * c)) / (2 * a)
}

const RACE_MIN_M = 400
const RACE_MAX_M = 100_000

/** Equivalent VO2max (ml·kg⁻¹·min⁻¹) of a race, Daniels & Gilbert (1979), "Oxygen Power": VO2(v) / %max(t). */
export function equivalentVo2max(distanceM: number, timeS: number): number {
  checkNumber('Race distance (m)', distanceM, RACE_MIN_M, RACE_MAX_M)
  checkTime(timeS)
  const minutes = timeS / 60
  const speed = distanceM / minutes
  if (speed > MAX_RACE_SPEED_M_PER_MIN) {
    throw new RangeError(`${formatDuration(timeS)} for ${distanceM} m is faster than humanly possible; check the time`)
  }
  const vo2max = oxygenCost(speed) / fractionSustained(minutes)
  if (vo2max < 1) {
    throw new RangeError(`${formatDuration(timeS)} for ${distanceM} m is too slow for a running estimate`)
  }
  return vo2max
}

/** The race time (s) over `distanceM` that has the given equivalent VO2max; inverse of equivalentVo2max. */
export function raceTimeForVo2max(vo2max: number, distanceM: number): number {
  checkNumber('VO2max (ml/kg/min)', vo2max, 10, 100)
  checkNumber('Race distance (m)', distanceM, RACE_MIN_M, RACE_MAX_M)
  const vo2maxAt = (minutes: number) => oxygenCost(distanceM / minutes) / fractionSustained(minutes)
  // vo2maxAt falls steadily as the time grows, so bisection between a too-fast and a too-slow time converges.
  let fast = distanceM / MAX_RACE_SPEED_M_PER_MIN
  let slow = fast * 2
  while (vo2maxAt(slow) > vo2max) {
    slow *= 2
  }
  for (let i = 0; i < 200 && slow - fast > 1e-9; i++) {
    const middle = (fast + slow) / 2
    if (vo2maxAt(middle) > vo2max) {
      fast = middle
    }
    else {
      slow = middle
    }
  }
  return (fast + slow) / 2 * 60
}

// Intensity of the training zones as a fraction of VO2max, from memory of Daniels' Running Formula
// (threshold ≈ 88 %, easy 59–74 %); converted to a speed with the Daniels & Gilbert (1979) oxygen cost.
const THRESHOLD_FRACTION = 0.88
const EASY_FAST_FRACTION = 0.74
const EASY_SLOW_FRACTION = 0.59

export const raceZoneDistancesM = { marathon: MARATHON_M, tenK: 10_000, fiveK: 5000, mile: MILE_M } as const

/** Training paces (s/km) from one benchmark race; race zones are that race's equivalent at each distance. */
export function trainingPaces(benchmark: RaceResult): TrainingPaces {
  const { distanceM, timeS } = benchmark
  const vo2max = equivalentVo2max(distanceM, timeS)
  const racePace = (zoneDistanceM: number) => Math.abs(zoneDistanceM - distanceM) < 1e-6
    ? paceFromRace(distanceM, timeS)
    : raceTimeForVo2max(checkBenchmarkVo2max(vo2max), zoneDistanceM) / (zoneDistanceM / 1000)
  const paceAt = (fraction: number) => 60_000 / speedForOxygenCost(fraction * vo2max)
  return {
    easy: { fast: paceAt(EASY_FAST_FRACTION), slow: paceAt(EASY_SLOW_FRACTION) },
    marathon: racePace(raceZoneDistancesM.marathon),
    threshold: paceAt(THRESHOLD_FRACTION),
    tenK: racePace(raceZoneDistancesM.tenK),
    fiveK: racePace(raceZoneDistancesM.fiveK),
    mile: racePace(raceZoneDistancesM.mile),
  }
}

function checkBenchmarkVo2max(vo2max: number): number {
  if (vo2max < 10 || vo2max > 100) {
    throw new RangeError(`The benchmark gives a VO2max of ${vo2max.toFixed(1)}, outside the 10–100 range these equations cover`)
  }
  return vo2max
}

const MINETTI_MAX_GRADE = 0.45

/**
 * Minetti et al. (2002), "Energy cost of walking and running at extreme uphill and downhill slopes",
 * J Appl Physiol 93:1039–1046: cost of running in J·kg⁻¹·m⁻¹ at grade i (a fraction), valid for −0.45..+0.45.
 */
export function minettiCost(grade: number): number {
  checkNumber('Grade', grade, -MINETTI_MAX_GRADE, MINETTI_MAX_GRADE)
  const i = grade
  return 155.4 * i ** 5 - 30.4 * i ** 4 - 43.3 * i ** 3 + 46.3 * i ** 2 + 19.5 * i + 3.6
}

/** The pace on a slope at the same metabolic power as `flatSecPerKm` on the flat: v_hill = v_flat·C(0)/C(i). */
export function hillPaceForEffort(flatSecPerKm: number, grade: number): number {
  checkNumber('Flat pace (s/km)', flatSecPerKm, 0, MAX_PACE_S_PER_KM, { exclusiveMin: true })
  return flatSecPerKm * minettiCost(grade) / minettiCost(0)
}

/** The flat pace with the same metabolic power as `hillSecPerKm` on the slope; inverse of hillPaceForEffort. */
export function flatEquivalentPace(hillSecPerKm: number, grade: number): number {
  checkNumber('Hill pace (s/km)', hillSecPerKm, 0, MAX_PACE_S_PER_KM, { exclusiveMin: true })
  return hillSecPerKm * minettiCost(0) / minettiCost(grade)
}

function checkDistance(distanceM: number, name = 'Distance (m)'): void {
  checkNumber(name, distanceM, 0, MAX_DISTANCE_M, { exclusiveMin: true })
}

function checkTime(timeS: number, name = 'Time (s)'): void {
  checkNumber(name, timeS, 0, MAX_DURATION_S, { exclusiveMin: true })
}

/**
 * Why a benchmark race cannot give training paces (the same checks `trainingPaces` and the race table
 * make), or null when it can. Used to refuse an implausible benchmark when it is saved.
 */
export function benchmarkProblem(benchmark: RaceResult): string | null {
  try {
    trainingPaces(benchmark)
    raceTimeForVo2max(equivalentVo2max(benchmark.distanceM, benchmark.timeS), MILE_M)
    return null
  }
  catch (error) {
    if (error instanceof RangeError || error instanceof TypeError) return error.message
    throw error
  }
}

/** Training paces, or null for a stored benchmark the equations cannot use (rows saved before the check). */
export function trainingPacesOrNull(benchmark: RaceResult): TrainingPaces | null {
  return benchmarkProblem(benchmark) === null ? trainingPaces(benchmark) : null
}
