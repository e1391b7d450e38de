import { checkNumber } from './numbers'

const MAX_KG = 1000
const MAX_REPS = 100
// Brzycki's denominator (37 − reps) reaches zero at 37 reps, and the estimate means little well before that.
const BRZYCKI_MAX_REPS = 36

export interface LiftEntry {
  kg: number
  reps: number
}

/** Epley (1985), "Poundage Chart", Boyd Epley Workout: 1RM = kg·(1 + reps/30); a single is its own 1RM. */
export function e1rmEpley(kg: number, reps: number): number {
  checkLift(kg, reps, MAX_REPS)
  return reps === 1 ? kg : kg * (1 + reps / 30)
}

/** Brzycki (1993), "Strength testing — predicting a one-rep max from reps-to-fatigue", JOPERD 64(1):88–90: kg·36/(37 − reps). */
export function e1rmBrzycki(kg: number, reps: number): number {
  checkLift(kg, reps, BRZYCKI_MAX_REPS)
  return kg * 36 / (37 - reps)
}

/** The load for a percentage (80 for 80 %) of an estimated 1RM, rounded to the nearest plate step (0 for no rounding). */
export function loadForPercent(e1rmKg: number, percent: number, roundToKg = 2.5): number {
  checkNumber('Estimated 1RM (kg)', e1rmKg, 0, MAX_KG, { exclusiveMin: true })
  // Capped at 100: a load above the estimated one-rep max is never prescribed.
  checkNumber('Percent of 1RM', percent, 0, 100, { exclusiveMin: true })
  checkNumber('Rounding step (kg)', roundToKg, 0, 50)
  const load = e1rmKg * percent / 100
  if (roundToKg === 0) {
    return load
  }
  // toFixed trims binary noise such as 82.50000000000001 from the multiplication.
  return Number((Math.round(load / roundToKg) * roundToKg).toFixed(6))
}

/** Volume load: the sum of kg × reps over all entries (bodyweight entries count 0 kg). */
export function volumeLoad(entries: readonly LiftEntry[]): number {
  if (!Array.isArray(entries)) {
    throw new TypeError('Volume load needs a list of { kg, reps } entries')
  }
  if (entries.length > 100_000) {
    throw new RangeError(`At most 100,000 entries (got ${entries.length})`)
  }
  return entries.reduce((total, entry, index) => {
    checkNumber(`Entry ${index + 1} load (kg)`, entry.kg, 0, MAX_KG)
    checkNumber(`Entry ${index + 1} reps`, entry.reps, 0, MAX_REPS * 10, { integer: true })
    return total + entry.kg * entry.reps
  }, 0)
}

function checkLift(kg: number, reps: number, maxReps: number): void {
  checkNumber('Load (kg)', kg, 0, MAX_KG, { exclusiveMin: true })
  checkNumber('Reps', reps, 1, maxReps, { integer: true })
}
