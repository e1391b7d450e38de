// The one vocabulary of Switchback: every stored key with the words people see for it.
// The database enums (server/db/schema.ts), the zod schemas (shared/schemas) and the screens,
// e-mails, calendar feed and CSV all read these lists; stored keys never change, labels may.

/** Stored keys, in order, with the words people see for each. */
export interface Vocabulary<Key extends string> {
  /** The keys as a tuple, for z.enum and Drizzle's text enums. */
  readonly values: readonly [Key, ...Key[]]
  readonly labels: Readonly<Record<Key, string>>
  /** `{ value, label }` pairs for a select or a group of choices. */
  readonly options: readonly { value: Key, label: string }[]
  /** A key in words; an unknown key is shown tidied, never raw, and no key is ''. */
  readonly label: (key: string | null | undefined) => string
}

/** One vocabulary from its label map; the map's order is the order of values and options. */
export function defineVocabulary<Key extends string>(labels: Readonly<Record<Key, string>>): Vocabulary<Key> {
  const values = Object.keys(labels) as [Key, ...Key[]]
  const known = (key: string): key is Key => (values as readonly string[]).includes(key)
  return {
    values,
    labels,
    options: values.map(value => ({ value, label: labels[value] })),
    label: key => !key ? '' : known(key) ? labels[key] : tidy(key),
  }
}

function tidy(key: string): string {
  const words = key.replace(/_/g, ' ')
  return words.charAt(0).toUpperCase() + words.slice(1)
}

export const roles = defineVocabulary({ head_coach: 'Head coach', coach: 'Coach', athlete: 'Athlete' })
export type Role = typeof roles.values[number]
/** The roles an invitation can give; a head coach is made, not invited. */
export const invitableRoles = ['athlete', 'coach'] as const satisfies readonly Role[]

// Exercise and routine categories keep their stored keys (singular for exercises, plural for
// routines); on screen both read as the same plural words so a coach sees one name per kind of work.
export const exerciseCategories = defineVocabulary({ strength: 'Strength', hill: 'Hills', drill: 'Drills', stride: 'Strides', mobility: 'Mobility', plyometric: 'Jumps (plyometrics)' })
export type ExerciseCategory = typeof exerciseCategories.values[number]
export const routineCategories = defineVocabulary({ strength: 'Strength', hills: 'Hills', drills: 'Drills and strides', mixed: 'Mixed' })
export type RoutineCategory = typeof routineCategories.values[number]

/** What people see: the stored status, plus "overdue" (still planned, its day has passed). */
export const shownStatuses = defineVocabulary({ planned: 'Planned', done: 'Done', partial: 'Partly done', skipped: 'Skipped', overdue: 'Missed' })
export type ShownStatus = typeof shownStatuses.values[number]
/** What happened to a planned session, as stored (set by the session player). */
export const assignmentStatuses = ['planned', 'done', 'partial', 'skipped'] as const satisfies readonly ShownStatus[]
export type AssignmentStatus = typeof assignmentStatuses[number]

// Kinds of timed step, named by what the athlete does.
export const blockKinds = defineVocabulary({ warmup: 'Easy start', work: 'Main effort', recovery: 'Easy between efforts', rest: 'Standing rest', cooldown: 'Easy finish' })
export type BlockKind = typeof blockKinds.values[number]
/** A line under each "add a step" button in the builder. */
export const blockKindHints: Record<BlockKind, string> = {
  warmup: 'easy running or mobility to begin',
  work: 'the main work: a climb, a stride, a drill or a steady run',
  recovery: 'jog or walk between efforts',
  rest: 'stand still and recover',
  cooldown: 'easy running to end the session',
}
export const stepTypeLabels = { sets: 'Gym sets', repeat: 'Rounds' } as const

export const paceZones = defineVocabulary({ easy: 'Easy pace', marathon: 'Marathon pace', threshold: 'Threshold pace', tenK: '10K pace', fiveK: '5K pace', mile: 'Mile pace' })
export type PaceZone = typeof paceZones.values[number]

export const bodyAreas = defineVocabulary({
  achilles: 'Achilles', calf: 'Calf', knee: 'Knee', hip: 'Hip', lower_back: 'Lower back', hamstring: 'Hamstring', quad: 'Thigh (quadriceps)',
  shin: 'Shin', foot: 'Foot', ankle: 'Ankle', glute: 'Buttock (glute)', groin: 'Groin', shoulder: 'Shoulder', neck: 'Neck',
})
export type BodyArea = typeof bodyAreas.values[number]

export const injuryStatuses = defineVocabulary({ active: 'Current', resolved: 'Healed' })
export type InjuryStatus = typeof injuryStatuses.values[number]

export const painFlagReasons = defineVocabulary({ high_pain: 'High pain', sudden: 'Sudden or sharp pain', new_area: 'Pain in a new place' })
export type PainFlagReason = typeof painFlagReasons.values[number]
export const painFlagStatuses = defineVocabulary({ open: 'Waiting for a coach', acknowledged: 'Seen by a coach' })
export type PainFlagStatus = typeof painFlagStatuses.values[number]

// One effort scale, 0–10, with our own anchor words; the builder, the player and the finish form use it.
export const effortScale: readonly string[] = [
  'At rest',
  'Barely moving',
  'Easy: chatting freely',
  'Comfortable: steady breathing',
  'Steady: full sentences still easy',
  'Breathing harder, focused',
  'Working: short sentences only',
  'Hard: a few words at a time',
  'Very hard: a word or two',
  'Close to the limit',
  'Nothing left',
]

/** The anchor words for an effort rating; halves take the lower point's words. */
export function effortWords(rpe: number): string {
  const point = Math.min(10, Math.max(0, Math.floor(rpe)))
  return effortScale[point]!
}

export const painScale: Record<number, string> = {
  0: 'No pain',
  2: 'Aware of it',
  4: 'Bothers me',
  6: 'Changes how I move',
  8: 'Hard to carry on',
  10: 'Worst I can imagine',
}

/** "1 session", "2 sessions"; pass the plural when it is not the singular plus "s". */
export function plural(count: number, singular: string, pluralForm = `${singular}s`): string {
  return `${count.toLocaleString('en-GB')} ${count === 1 ? singular : pluralForm}`
}

/** The unit of session load wherever it is shown or compared (Foster 2001: RPE × minutes). */
export const LOAD_UNIT = 'effort × min'
