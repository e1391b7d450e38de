// Age from a birth year only (the profile stores no full date of birth). Where a rule protects
// young athletes, the year is read cautiously: born in the year that turns 18 this year counts as under 18.

export const ADULT_AGE = 18

/** The youngest the athlete can be this year: years since the birth year, minus one. */
export function youngestAge(birthYear: number, today = new Date()): number {
  return today.getUTCFullYear() - birthYear - 1
}

/** True when the athlete may be under 18; false when the birth year is unknown. */
export function isUnder18(birthYear: number | null | undefined, today = new Date()): boolean {
  return birthYear != null && youngestAge(birthYear, today) < ADULT_AGE
}
