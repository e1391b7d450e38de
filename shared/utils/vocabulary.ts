// The one vocabulary of Switchback: every stored key with the words people see for it.
// The database enums (server/db/schema.ts), the zod schemas (shared/schemas) and the screens,
// e-mails, calendar feed and CSV all read these lists; stored keys never change, labels may.

export const roles = ['head_coach', 'coach', 'athlete'] as const
export type Role = typeof roles[number]
export const roleLabels: Record<Role, string> = { head_coach: 'Head coach', coach: 'Coach', athlete: 'Athlete' }
/** The roles an invitation can give; a head coach is made, not invited. */
export const invitableRoles = ['athlete', 'coach'] as const satisfies readonly Role[]

// Exercise and routine categories keep their stored keys (singular for exercises, plural for
// routines); on screen both read as the same plural words so a coach sees one name per kind of work.
export const exerciseCategories = ['strength', 'hill', 'drill', 'stride', 'mobility', 'plyometric'] as const
export type ExerciseCategory = typeof exerciseCategories[number]
export const exerciseCategoryLabels: Record<ExerciseCategory, string> = {
  strength: 'Strength',
  hill: 'Hills',
  drill: 'Drills',
  stride: 'Strides',
  mobility: 'Mobility',
  plyometric: 'Jumps (plyometrics)',
}

/** An exercise category in words; an unknown key is shown tidied, never raw. */
export function exerciseCategoryLabel(category: string): string {
  return exerciseCategoryLabels[category as ExerciseCategory] ?? tidy(category)
}

export const routineCategories = ['strength', 'hills', 'drills', 'mixed'] as const
export type RoutineCategory = typeof routineCategories[number]
export const routineCategoryLabels: Record<RoutineCategory, string> = {
  strength: 'Strength',
  hills: 'Hills',
  drills: 'Drills and strides',
  mixed: 'Mixed',
}

export function routineCategoryLabel(category: string): string {
  return routineCategoryLabels[category as RoutineCategory] ?? tidy(category)
}

/** What happened to a planned session, as stored (set by the session player). */
export const assignmentStatuses = ['planned', 'done', 'partial', 'skipped'] as const
export type AssignmentStatus = typeof assignmentStatuses[number]
/** What people see: the stored status, plus "overdue" (still planned, its day has passed). */
export const shownStatuses = ['planned', 'done', 'partial', 'skipped', 'overdue'] as const
export type ShownStatus = typeof shownStatuses[number]
export const statusLabels: Record<ShownStatus, string> = {
  planned: 'Planned',
  done: 'Done',
  partial: 'Partly done',
  skipped: 'Skipped',
  overdue: 'Missed',
}

// Kinds of timed step, named by what the athlete does.
export const blockKinds = ['warmup', 'work', 'recovery', 'rest', 'cooldown'] as const
export type BlockKind = typeof blockKinds[number]
export const blockKindLabels: Record<BlockKind, string> = {
  warmup: 'Easy start',
  work: 'Main effort',
  recovery: 'Easy between efforts',
  rest: 'Standing rest',
  cooldown: 'Easy finish',
}
/** A line under each "add a step" button in the builder. */
export const blockKindHints: Record<BlockKind, string> = {
  warmup: 'easy running or mobility to begin',
  work: 'the main work: a climb, a stride, a drill or a steady run',
  recovery: 'jog or walk between efforts',
  rest: 'stand still and recover',
  cooldown: 'easy running to end the session',
}
export const stepTypeLabels = { sets: 'Gym sets', repeat: 'Rounds' } as const

export const bodyAreas = ['achilles', 'calf', 'knee', 'hip', 'lower_back', 'hamstring', 'quad', 'shin', 'foot', 'ankle', 'glute', 'groin', 'shoulder', 'neck'] as const
export type BodyArea = typeof bodyAreas[number]
export const bodyAreaLabels: Record<BodyArea, string> = {
  achilles: 'Achilles',
  calf: 'Calf',
  knee: 'Knee',
  hip: 'Hip',
  lower_back: 'Lower back',
  hamstring: 'Hamstring',
  quad: 'Thigh (quadriceps)',
  shin: 'Shin',
  foot: 'Foot',
  ankle: 'Ankle',
  glute: 'Buttock (glute)',
  groin: 'Groin',
  shoulder: 'Shoulder',
  neck: 'Neck',
}

/** A body area in words; unknown keys are tidied rather than shown raw. */
export function bodyAreaLabel(area: string | null | undefined): string {
  if (!area) return ''
  return bodyAreaLabels[area as BodyArea] ?? tidy(area)
}

function tidy(key: string): string {
  const words = key.replace(/_/g, ' ')
  return words.charAt(0).toUpperCase() + words.slice(1)
}

export const injuryStatuses = ['active', 'resolved'] as const
export type InjuryStatus = typeof injuryStatuses[number]
export const injuryStatusLabels: Record<InjuryStatus, string> = { active: 'Current', resolved: 'Healed' }

export const painFlagReasons = ['high_pain', 'sudden', 'new_area'] as const
export type PainFlagReason = typeof painFlagReasons[number]
export const painFlagReasonLabels: Record<PainFlagReason, string> = { high_pain: 'High pain', sudden: 'Sudden or sharp pain', new_area: 'Pain in a new place' }
export const painFlagStatuses = ['open', 'acknowledged'] as const
export type PainFlagStatus = typeof painFlagStatuses[number]
export const painFlagStatusLabels: Record<PainFlagStatus, string> = { open: 'Waiting for a coach', acknowledged: 'Seen by a coach' }

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

/** `{ value, label }` pairs for a select or a group of choices, in the vocabulary's order. */
export function choices<T extends string>(values: readonly T[], labels: Record<T, string>) {
  return values.map(value => ({ value, label: labels[value] }))
}

export const bodyAreaOptions = choices(bodyAreas, bodyAreaLabels)
