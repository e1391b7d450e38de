import { checkNumber } from './numbers'

/** Tanaka, Monahan & Seals (2001), "Age-predicted maximal heart rate revisited", J Am Coll Cardiol 37:153–156: 208 − 0.7·age. */
export function hrMaxTanaka(age: number): number {
  checkNumber('Age (years)', age, 5, 110)
  return 208 - 0.7 * age
}

/**
 * Karvonen, Kentala & Mustala (1957), "The effects of training on heart rate; a longitudinal study",
 * Ann Med Exp Biol Fenn 35:307–315: target = rest + intensity·(max − rest), intensity 0..1 of the reserve.
 */
export function karvonen(hrMax: number, hrRest: number, intensity: number): number {
  checkNumber('Maximum heart rate (bpm)', hrMax, 60, 250)
  checkNumber('Resting heart rate (bpm)', hrRest, 20, 150)
  checkNumber('Intensity (fraction of heart-rate reserve)', intensity, 0, 1)
  if (hrRest >= hrMax) {
    throw new RangeError(`Resting heart rate (${hrRest}) must be below maximum heart rate (${hrMax})`)
  }
  return hrRest + intensity * (hrMax - hrRest)
}
