import { checkNumber } from './numbers'

// Daily loads are in arbitrary units (usually session RPE × minutes), one per day, oldest first.

const MAX_DAYS = 100_000
const MAX_DAILY_LOAD = 1_000_000
const MAX_WINDOW_DAYS = 365

/** Foster et al. (2001), "A new approach to monitoring exercise training", J Strength Cond Res 15:109–115: CR-10 RPE × minutes. */
export function sessionLoad(rpe: number, minutes: number): number {
  checkNumber('Session RPE', rpe, 0, 10)
  checkNumber('Duration (min)', minutes, 0, 24 * 60)
  return rpe * minutes
}

/** Totals of consecutive blocks of `daysPerWeek` days from the oldest day; the newest block may be partial. */
export function weeklyTotals(dailyLoads: readonly number[], daysPerWeek = 7): number[] {
  checkLoads(dailyLoads)
  checkNumber('Days per week', daysPerWeek, 1, MAX_WINDOW_DAYS, { integer: true })
  const totals: number[] = []
  for (let start = 0; start < dailyLoads.length; start += daysPerWeek) {
    totals.push(sum(dailyLoads.slice(start, start + daysPerWeek)))
  }
  return totals
}

/**
 * Acute:chronic workload ratio for the last day from rolling means — Hulin et al. (2014), "Spikes in acute
 * workload are associated with increased injury risk in elite cricket fast bowlers", Br J Sports Med 48:708–712;
 * Gabbett (2016), "The training–injury prevention paradox", Br J Sports Med 50:273–280.
 * Null with fewer than `chronic` days or a chronic mean of 0.
 */
export function acwrRolling(dailyLoads: readonly number[], acute = 7, chronic = 28): number | null {
  checkLoads(dailyLoads)
  checkWindows(acute, chronic)
  if (dailyLoads.length < chronic) {
    return null
  }
  const chronicMean = mean(dailyLoads.slice(-chronic))
  if (chronicMean === 0) {
    return null
  }
  return mean(dailyLoads.slice(-acute)) / chronicMean
}

/**
 * Acute:chronic workload ratio for the last day from exponentially weighted averages — Williams et al. (2017),
 * "Better way to determine the acute:chronic workload ratio?", Br J Sports Med 51:209–210: λ = 2/(N + 1),
 * EWMA_today = load·λ + (1 − λ)·EWMA_yesterday. Both averages start at the first day's load, so a steady load
 * reads 1 from the start. Null with fewer than `chronic` days or a chronic average of 0.
 */
export function acwrEwma(dailyLoads: readonly number[], acute = 7, chronic = 28): number | null {
  checkLoads(dailyLoads)
  checkWindows(acute, chronic)
  if (dailyLoads.length < chronic) {
    return null
  }
  const acuteLambda = 2 / (acute + 1)
  const chronicLambda = 2 / (chronic + 1)
  let acuteAverage = dailyLoads[0]!
  let chronicAverage = dailyLoads[0]!
  for (const load of dailyLoads.slice(1)) {
    acuteAverage = load * acuteLambda + (1 - acuteLambda) * acuteAverage
    chronicAverage = load * chronicLambda + (1 - chronicLambda) * chronicAverage
  }
  if (chronicAverage === 0) {
    return null
  }
  return acuteAverage / chronicAverage
}

/**
 * Foster (1998), "Monitoring training in athletes with reference to overtraining syndrome", Med Sci Sports Exerc
 * 30:1164–1168: monotony = mean daily load / standard deviation over the week. The SD is the population SD
 * (the week's days are all the days, not a sample). Null when every day is the same (SD 0).
 */
export function monotony(weekDailyLoads: readonly number[]): number | null {
  checkWeek(weekDailyLoads)
  const average = mean(weekDailyLoads)
  const sd = Math.sqrt(mean(weekDailyLoads.map(load => (load - average) ** 2)))
  // Equal days can leave floating-point dust in the SD; treat that as no variation at all.
  if (sd <= 1e-9 * Math.max(1, average)) {
    return null
  }
  return average / sd
}

/** Foster (1998), "Monitoring training in athletes with reference to overtraining syndrome": strain = weekly total × monotony. */
export function strain(weekDailyLoads: readonly number[]): number | null {
  const weekMonotony = monotony(weekDailyLoads)
  return weekMonotony === null ? null : sum(weekDailyLoads) * weekMonotony
}

function sum(values: readonly number[]): number {
  return values.reduce((total, value) => total + value, 0)
}

function mean(values: readonly number[]): number {
  return sum(values) / values.length
}

function checkLoads(dailyLoads: readonly number[]): void {
  if (!Array.isArray(dailyLoads)) {
    throw new TypeError('Daily loads must be a list of numbers, oldest day first')
  }
  if (dailyLoads.length > MAX_DAYS) {
    throw new RangeError(`At most ${MAX_DAYS} days of loads (got ${dailyLoads.length})`)
  }
  dailyLoads.forEach((load, index) => checkNumber(`Load on day ${index + 1}`, load, 0, MAX_DAILY_LOAD))
}

function checkWindows(acute: number, chronic: number): void {
  checkNumber('Acute window (days)', acute, 1, MAX_WINDOW_DAYS, { integer: true })
  checkNumber('Chronic window (days)', chronic, 1, MAX_WINDOW_DAYS, { integer: true })
  if (acute > chronic) {
    throw new RangeError(`The acute window (${acute} days) cannot be longer than the chronic window (${chronic} days)`)
  }
}

function checkWeek(weekDailyLoads: readonly number[]): void {
  checkLoads(weekDailyLoads)
  if (weekDailyLoads.length < 2 || weekDailyLoads.length > 31) {
    throw new RangeError(`Monotony needs between 2 and 31 daily loads, usually 7 (got ${weekDailyLoads.length})`)
  }
}
