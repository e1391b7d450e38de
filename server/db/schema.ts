import { sql } from 'drizzle-orm'
import { foreignKey, index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core'
import type { RoutineStep } from '#shared/schemas/routine-steps'
import type { AssignmentSnapshot, ExerciseCaution } from '#shared/types/domain'
import type { FieldOverride, LighterWeeks, ProgressionRule, Taper } from '#shared/utils/progression'
import { assignmentStatuses, exerciseCategories, injuryStatuses, invitableRoles, painFlagReasons, painFlagStatuses, roles, routineCategories } from '#shared/utils/vocabulary'

const timestamps = {
  createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch('subsec') * 1000)`),
  updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch('subsec') * 1000)`).$onUpdate(() => new Date()),
}

// The enums come from the one vocabulary in shared/utils/vocabulary.ts.
export { assignmentStatuses, exerciseCategories, roles, routineCategories }

export const teams = sqliteTable('teams', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  name: text('name').notNull(),
  // Shown in the urgent-help guidance; never a built-in default, since the number depends on the country.
  emergencyNumber: text('emergency_number'),
  // The smallest total change the team's plates allow; block loads round to it.
  plateIncrementKg: real('plate_increment_kg').notNull().default(2.5),
  timezone: text('timezone').notNull().default('UTC'),
  // When the head coach dismissed the first-run checklist on the coach's home.
  checklistDismissedAt: integer('checklist_dismissed_at', { mode: 'timestamp_ms' }),
  /** Athletes' form-review clips older than this are removed by the media sweep. */
  reviewRetentionDays: integer('review_retention_days').notNull().default(180),
  ...timestamps,
})

export const users = sqliteTable('users', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  email: text('email').notNull(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  timezone: text('timezone').notNull().default('UTC'),
  notifyByEmail: integer('notify_by_email', { mode: 'boolean' }).notNull().default(true),
  // When the athlete answered or skipped the first-visit questions.
  welcomedAt: integer('welcomed_at', { mode: 'timestamp_ms' }),
  ...timestamps,
}, t => [uniqueIndex('users_email_unique').on(t.email)])

export const memberships = sqliteTable('memberships', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  role: text('role', { enum: roles.values }).notNull(),
  /** Coaches get an e-mail for each new pain flag unless they turn it off. */
  painFlagEmails: integer('pain_flag_emails', { mode: 'boolean' }).notNull().default(true),
  ...timestamps,
}, t => [
  uniqueIndex('memberships_team_user_unique').on(t.teamId, t.userId),
  index('memberships_user_idx').on(t.userId),
  index('memberships_team_role_idx').on(t.teamId, t.role),
])

/**
 * A removed athlete whose history the team keeps under a neutral label ("Former athlete 3") instead of
 * their name; `number` is stable per person within the team.
 */
export const anonymisedMembers = sqliteTable('anonymised_members', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  number: integer('number').notNull(),
  ...timestamps,
}, t => [
  uniqueIndex('anonymised_members_team_user_unique').on(t.teamId, t.userId),
  uniqueIndex('anonymised_members_team_number_unique').on(t.teamId, t.number),
  index('anonymised_members_user_idx').on(t.userId),
])

export const squads = sqliteTable('squads', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  description: text('description').notNull().default(''),
  ...timestamps,
}, t => [index('squads_team_idx').on(t.teamId)])

export const squadMembers = sqliteTable('squad_members', {
  squadId: integer('squad_id').notNull().references(() => squads.id, { onDelete: 'cascade' }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  joinedAt: integer('joined_at', { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch('subsec') * 1000)`),
}, t => [
  primaryKey({ columns: [t.squadId, t.userId] }),
  index('squad_members_user_idx').on(t.userId),
])

export const athleteProfiles = sqliteTable('athlete_profiles', {
  userId: integer('user_id').primaryKey().references(() => users.id, { onDelete: 'cascade' }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  benchmarkDistanceM: real('benchmark_distance_m'),
  benchmarkTimeS: real('benchmark_time_s'),
  benchmarkDate: text('benchmark_date'),
  birthYear: integer('birth_year'),
  hrMax: integer('hr_max'),
  hrRest: integer('hr_rest'),
  units: text('units', { enum: ['km', 'mi'] }).notNull().default('km'),
  goal: text('goal').notNull().default(''),
  /** A parent or guardian to reach, asked of athletes under 18. */
  guardianContact: text('guardian_contact').notNull().default(''),
  ...timestamps,
}, t => [index('athlete_profiles_team_idx').on(t.teamId)])

export const injuryNotes = sqliteTable('injury_notes', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  athleteId: integer('athlete_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  bodyArea: text('body_area').notNull(),
  status: text('status', { enum: injuryStatuses.values }).notNull().default('active'),
  note: text('note').notNull().default(''),
  since: text('since'),
  ...timestamps,
}, t => [
  index('injury_notes_team_idx').on(t.teamId),
  index('injury_notes_athlete_status_idx').on(t.athleteId, t.status),
])

export const invites = sqliteTable('invites', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  email: text('email').notNull(),
  role: text('role', { enum: invitableRoles }).notNull(),
  squadId: integer('squad_id').references(() => squads.id, { onDelete: 'set null' }),
  tokenHash: text('token_hash').notNull(),
  invitedById: integer('invited_by_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
  acceptedAt: integer('accepted_at', { mode: 'timestamp_ms' }),
  revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
  ...timestamps,
}, t => [
  uniqueIndex('invites_token_unique').on(t.tokenHash),
  index('invites_team_idx').on(t.teamId),
  index('invites_squad_idx').on(t.squadId),
  index('invites_invited_by_idx').on(t.invitedById),
  index('invites_email_idx').on(t.email),
])

export const passwordResets = sqliteTable('password_resets', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: text('token_hash').notNull(),
  expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
  usedAt: integer('used_at', { mode: 'timestamp_ms' }),
  ...timestamps,
}, t => [
  uniqueIndex('password_resets_token_unique').on(t.tokenHash),
  index('password_resets_user_idx').on(t.userId),
])

// One row per sign-in. The sealed cookie carries only a random id; its hash is kept here, so signing
// out, a password change or a reset can end sessions on the server. Rows hang off the membership, so
// removing someone from a team ends their sessions there by itself.
export const authSessions = sqliteTable('auth_sessions', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  tokenHash: text('token_hash').notNull(),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
  ...timestamps,
}, t => [
  uniqueIndex('auth_sessions_token_unique').on(t.tokenHash),
  index('auth_sessions_user_team_idx').on(t.userId, t.teamId),
  index('auth_sessions_team_idx').on(t.teamId),
  foreignKey({ columns: [t.teamId, t.userId], foreignColumns: [memberships.teamId, memberships.userId], name: 'auth_sessions_membership_fk' }).onDelete('cascade'),
])

// Rate-limit hits (e-mails sent, etc.) by key, in the database so limits hold across app replicas.
export const rateEvents = sqliteTable('rate_events', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  key: text('key').notNull(),
  at: integer('at', { mode: 'timestamp_ms' }).notNull(),
}, t => [index('rate_events_key_at_idx').on(t.key, t.at)])

// Failed sign-ins, kept in the database so throttling holds across app replicas.
export const loginFailures = sqliteTable('login_failures', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  email: text('email').notNull(),
  ip: text('ip').notNull(),
  at: integer('at', { mode: 'timestamp_ms' }).notNull(),
}, t => [
  index('login_failures_email_at_idx').on(t.email, t.at),
  index('login_failures_ip_at_idx').on(t.ip, t.at),
])

export const emailOutbox = sqliteTable('email_outbox', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').references(() => teams.id, { onDelete: 'set null' }),
  to: text('to').notNull(),
  template: text('template').notNull(),
  payload: text('payload', { mode: 'json' }).notNull().$type<Record<string, unknown>>(),
  status: text('status', { enum: ['pending', 'sending', 'sent', 'failed'] }).notNull().default('pending'),
  attempts: integer('attempts').notNull().default(0),
  lastError: text('last_error'),
  nextAttemptAt: integer('next_attempt_at', { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch('subsec') * 1000)`),
  lockedUntil: integer('locked_until', { mode: 'timestamp_ms' }),
  sentAt: integer('sent_at', { mode: 'timestamp_ms' }),
  ...timestamps,
}, t => [
  index('email_outbox_status_next_idx').on(t.status, t.nextAttemptAt),
  index('email_outbox_team_idx').on(t.teamId),
])

export const mediaObjects = sqliteTable('media_objects', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  exerciseId: integer('exercise_id'),
  key: text('key').notNull(),
  purpose: text('purpose', { enum: ['clip', 'poster'] }).notNull().default('clip'),
  contentType: text('content_type').notNull(),
  size: integer('size').notNull(),
  status: text('status', { enum: ['pending', 'ready', 'deleted'] }).notNull().default('pending'),
  // Read from the container at confirm (clips only); null for posters and clips stored before.
  durationSeconds: real('duration_seconds'),
  width: integer('width'),
  height: integer('height'),
  createdById: integer('created_by_id').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  uniqueIndex('media_objects_key_unique').on(t.key),
  index('media_objects_team_status_idx').on(t.teamId, t.status),
  index('media_objects_exercise_idx').on(t.exerciseId),
  index('media_objects_created_by_idx').on(t.createdById),
])

export const exercises = sqliteTable('exercises', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  category: text('category', { enum: exerciseCategories.values }).notNull(),
  summary: text('summary').notNull().default(''),
  cues: text('cues', { mode: 'json' }).notNull().$type<string[]>().default(sql`'[]'`),
  equipment: text('equipment', { mode: 'json' }).notNull().$type<string[]>().default(sql`'[]'`),
  cautions: text('cautions', { mode: 'json' }).notNull().$type<ExerciseCaution[]>().default(sql`'[]'`),
  clipId: integer('clip_id').references(() => mediaObjects.id, { onDelete: 'set null' }),
  posterId: integer('poster_id').references(() => mediaObjects.id, { onDelete: 'set null' }),
  // Set on copies of the starter set: which starter exercise this is, so adding the set again skips it.
  starterKey: text('starter_key'),
  archivedAt: integer('archived_at', { mode: 'timestamp_ms' }),
  createdById: integer('created_by_id').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  uniqueIndex('exercises_team_starter_unique').on(t.teamId, t.starterKey),
  index('exercises_team_category_idx').on(t.teamId, t.category),
  index('exercises_team_name_idx').on(t.teamId, t.name),
  index('exercises_clip_idx').on(t.clipId),
  index('exercises_poster_idx').on(t.posterId),
  index('exercises_created_by_idx').on(t.createdById),
  index('exercises_archived_idx').on(t.teamId, t.archivedAt),
])

// Form cues pinned to moments of an exercise's clip. They belong to the exercise, not to one file,
// so replacing the clip keeps them.
export const clipCues = sqliteTable('clip_cues', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  exerciseId: integer('exercise_id').notNull().references(() => exercises.id, { onDelete: 'cascade' }),
  startSeconds: real('start_seconds').notNull(),
  endSeconds: real('end_seconds'),
  text: text('text').notNull(),
  createdById: integer('created_by_id').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  index('clip_cues_exercise_idx').on(t.exerciseId, t.startSeconds),
  index('clip_cues_team_idx').on(t.teamId),
  index('clip_cues_created_by_idx').on(t.createdById),
])

// Form review: an athlete's clip of a drill or lift, the coach's comments at moments in it, and a reply clip.
export const formReviews = sqliteTable('form_reviews', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  athleteId: integer('athlete_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  clipId: integer('clip_id').notNull().references(() => mediaObjects.id, { onDelete: 'cascade' }),
  question: text('question').notNull().default(''),
  assignmentId: integer('assignment_id').references(() => assignments.id, { onDelete: 'set null' }),
  stepId: text('step_id'),
  /** A library exercise the coach links, whose cues open beside the clip. */
  exerciseId: integer('exercise_id').references(() => exercises.id, { onDelete: 'set null' }),
  replyClipId: integer('reply_clip_id').references(() => mediaObjects.id, { onDelete: 'set null' }),
  status: text('status', { enum: ['open', 'answered'] }).notNull().default('open'),
  answeredAt: integer('answered_at', { mode: 'timestamp_ms' }),
  answeredById: integer('answered_by_id').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  index('form_reviews_team_status_idx').on(t.teamId, t.status, t.createdAt),
  index('form_reviews_athlete_idx').on(t.athleteId),
  index('form_reviews_clip_idx').on(t.clipId),
  index('form_reviews_reply_clip_idx').on(t.replyClipId),
  index('form_reviews_assignment_idx').on(t.assignmentId),
  index('form_reviews_exercise_idx').on(t.exerciseId),
  index('form_reviews_answered_by_idx').on(t.answeredById),
])

export const formReviewComments = sqliteTable('form_review_comments', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  reviewId: integer('review_id').notNull().references(() => formReviews.id, { onDelete: 'cascade' }),
  authorId: integer('author_id').references(() => users.id, { onDelete: 'set null' }),
  atSeconds: real('at_seconds').notNull(),
  text: text('text').notNull(),
  ...timestamps,
}, t => [
  index('form_review_comments_review_idx').on(t.reviewId, t.atSeconds),
  index('form_review_comments_team_idx').on(t.teamId),
  index('form_review_comments_author_idx').on(t.authorId),
])

export const routines = sqliteTable('routines', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  title: text('title').notNull(),
  category: text('category', { enum: routineCategories.values }).notNull(),
  description: text('description').notNull().default(''),
  steps: text('steps', { mode: 'json' }).notNull().$type<RoutineStep[]>(),
  version: integer('version').notNull().default(1),
  isTemplate: integer('is_template', { mode: 'boolean' }).notNull().default(false),
  starterKey: text('starter_key'),
  archivedAt: integer('archived_at', { mode: 'timestamp_ms' }),
  createdById: integer('created_by_id').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  uniqueIndex('routines_team_starter_unique').on(t.teamId, t.starterKey),
  index('routines_team_category_idx').on(t.teamId, t.category),
  index('routines_team_title_idx').on(t.teamId, t.title),
  index('routines_created_by_idx').on(t.createdById),
])

// Which exercises a routine's current version uses; rewritten on each save, read for "where used".
export const routineExercises = sqliteTable('routine_exercises', {
  routineId: integer('routine_id').notNull().references(() => routines.id, { onDelete: 'cascade' }),
  exerciseId: integer('exercise_id').notNull().references(() => exercises.id, { onDelete: 'cascade' }),
}, t => [
  primaryKey({ columns: [t.routineId, t.exerciseId] }),
  index('routine_exercises_exercise_idx').on(t.exerciseId),
])

export const assignmentSeries = sqliteTable('assignment_series', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  routineId: integer('routine_id').notNull().references(() => routines.id, { onDelete: 'cascade' }),
  squadId: integer('squad_id').references(() => squads.id, { onDelete: 'set null' }),
  startDate: text('start_date').notNull(),
  weeks: integer('weeks').notNull(),
  weekdays: text('weekdays', { mode: 'json' }).notNull().$type<number[]>(),
  note: text('note').notNull().default(''),
  createdById: integer('created_by_id').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  index('assignment_series_team_idx').on(t.teamId),
  index('assignment_series_routine_idx').on(t.routineId),
  index('assignment_series_squad_idx').on(t.squadId),
  index('assignment_series_created_by_idx').on(t.createdById),
])

export const blocks = sqliteTable('blocks', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  startDate: text('start_date').notNull(),
  weeks: integer('weeks').notNull(),
  goalRaceName: text('goal_race_name'),
  goalRaceDate: text('goal_race_date'),
  goalRaceDistanceM: real('goal_race_distance_m'),
  lighter: text('lighter', { mode: 'json' }).$type<LighterWeeks>(),
  taper: text('taper', { mode: 'json' }).$type<Taper>(),
  note: text('note').notNull().default(''),
  plannedAt: integer('planned_at', { mode: 'timestamp_ms' }),
  // Bumped on every change, so the page can say whether the planned sessions are behind.
  revision: integer('revision').notNull().default(1),
  plannedRevision: integer('planned_revision'),
  createdById: integer('created_by_id').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  index('blocks_team_start_idx').on(t.teamId, t.startDate),
  index('blocks_created_by_idx').on(t.createdById),
])

export const blockRoutines = sqliteTable('block_routines', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  blockId: integer('block_id').notNull().references(() => blocks.id, { onDelete: 'cascade' }),
  routineId: integer('routine_id').notNull().references(() => routines.id, { onDelete: 'restrict' }),
  /** 1 = Monday … 7 = Sunday */
  weekday: integer('weekday').notNull(),
  position: integer('position').notNull().default(0),
  rules: text('rules', { mode: 'json' }).notNull().$type<ProgressionRule[]>().default(sql`'[]'`),
  note: text('note').notNull().default(''),
}, t => [
  index('block_routines_block_idx').on(t.blockId),
  index('block_routines_routine_idx').on(t.routineId),
])

export const blockTargets = sqliteTable('block_targets', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  blockId: integer('block_id').notNull().references(() => blocks.id, { onDelete: 'cascade' }),
  athleteId: integer('athlete_id').references(() => users.id, { onDelete: 'cascade' }),
  squadId: integer('squad_id').references(() => squads.id, { onDelete: 'cascade' }),
}, t => [
  index('block_targets_block_idx').on(t.blockId),
  index('block_targets_athlete_idx').on(t.athleteId),
  index('block_targets_squad_idx').on(t.squadId),
])

// A week of one routine set by hand: these numbers win over the rules and the week's scaling.
export const blockWeekOverrides = sqliteTable('block_week_overrides', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  blockId: integer('block_id').notNull().references(() => blocks.id, { onDelete: 'cascade' }),
  blockRoutineId: integer('block_routine_id').notNull().references(() => blockRoutines.id, { onDelete: 'cascade' }),
  week: integer('week').notNull(),
  values: text('values', { mode: 'json' }).notNull().$type<FieldOverride[]>(),
  ...timestamps,
}, t => [
  uniqueIndex('block_week_overrides_unique').on(t.blockRoutineId, t.week),
  index('block_week_overrides_block_idx').on(t.blockId),
])

// One row per planning request that carried an idempotency key, so a repeated request returns the
// first answer instead of planning the sessions twice.
export const assignmentBatches = sqliteTable('assignment_batches', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  idempotencyKey: text('idempotency_key').notNull(),
  result: text('result', { mode: 'json' }).$type<Record<string, unknown>>(),
  createdById: integer('created_by_id').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  uniqueIndex('assignment_batches_team_key_unique').on(t.teamId, t.idempotencyKey),
  index('assignment_batches_created_by_idx').on(t.createdById),
])

export const assignments = sqliteTable('assignments', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  athleteId: integer('athlete_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  routineId: integer('routine_id').notNull().references(() => routines.id, { onDelete: 'restrict' }),
  routineVersion: integer('routine_version').notNull(),
  snapshot: text('snapshot', { mode: 'json' }).notNull().$type<AssignmentSnapshot>(),
  date: text('date').notNull(),
  seriesId: integer('series_id').references(() => assignmentSeries.id, { onDelete: 'set null' }),
  note: text('note').notNull().default(''),
  status: text('status', { enum: assignmentStatuses }).notNull().default('planned'),
  assignedById: integer('assigned_by_id').references(() => users.id, { onDelete: 'set null' }),
  blockId: integer('block_id').references(() => blocks.id, { onDelete: 'set null' }),
  blockWeek: integer('block_week'),
  // Which routine slot of the block; no foreign key, so editing a block's slots never blocks on history.
  blockRoutineId: integer('block_routine_id'),
  ...timestamps,
}, t => [
  index('assignments_team_date_idx').on(t.teamId, t.date),
  index('assignments_block_week_idx').on(t.blockId, t.blockWeek),
  index('assignments_block_routine_idx').on(t.blockRoutineId),
  index('assignments_athlete_date_idx').on(t.athleteId, t.date),
  // Covers the team table's compliance counts (one athlete's days, then the status) without reading the rows.
  index('assignments_team_athlete_date_status_idx').on(t.teamId, t.athleteId, t.date, t.status),
  index('assignments_routine_idx').on(t.routineId),
  index('assignments_series_idx').on(t.seriesId),
  index('assignments_assigned_by_idx').on(t.assignedById),
])

export const calendarFeeds = sqliteTable('calendar_feeds', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: text('token_hash').notNull(),
  revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
  ...timestamps,
}, t => [
  uniqueIndex('calendar_feeds_token_unique').on(t.tokenHash),
  index('calendar_feeds_user_idx').on(t.userId),
  index('calendar_feeds_team_idx').on(t.teamId),
])

export const sessionLogs = sqliteTable('session_logs', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  assignmentId: integer('assignment_id').notNull().references(() => assignments.id, { onDelete: 'cascade' }),
  athleteId: integer('athlete_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  clientId: text('client_id').notNull(),
  startedAt: integer('started_at', { mode: 'timestamp_ms' }).notNull(),
  finishedAt: integer('finished_at', { mode: 'timestamp_ms' }),
  // The calendar day (athlete's time zone) the session counts for; aggregated by day in insights.
  day: text('day').notNull(),
  durationS: integer('duration_s'),
  sessionRpe: real('session_rpe'),
  // Session-RPE load (RPE × minutes), stored at finish so insights aggregate it in SQL.
  load: real('load'),
  pain: integer('pain'),
  painArea: text('pain_area'),
  /** The athlete said the pain came on suddenly or is sharp. */
  painSudden: integer('pain_sudden', { mode: 'boolean' }).notNull().default(false),
  note: text('note').notNull().default(''),
  /**
   * The loggable sets and intervals of the routine as the session started (key and exercise), so an
   * entry is checked against them without planning the session again; null on sessions started before.
   */
  segmentKeys: text('segment_keys', { mode: 'json' }).$type<{ key: string, exerciseId: number | null }[]>(),
  ...timestamps,
}, t => [
  uniqueIndex('session_logs_athlete_client_unique').on(t.athleteId, t.clientId),
  index('session_logs_assignment_idx').on(t.assignmentId),
  index('session_logs_athlete_day_idx').on(t.athleteId, t.day),
  index('session_logs_team_day_idx').on(t.teamId, t.day),
  // Covers the insights query (team, date range → athlete, load) so it never reads the table rows.
  index('session_logs_team_day_load_idx').on(t.teamId, t.day, t.athleteId, t.load),
  // The same per athlete: the team table walks each athlete's days in order, so their totals need no sort.
  index('session_logs_team_athlete_day_load_idx').on(t.teamId, t.athleteId, t.day, t.load),
])

export const entryLogs = sqliteTable('entry_logs', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  sessionId: integer('session_id').notNull().references(() => sessionLogs.id, { onDelete: 'cascade' }),
  athleteId: integer('athlete_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  idempotencyKey: text('idempotency_key').notNull(),
  stepId: text('step_id').notNull(),
  exerciseId: integer('exercise_id').references(() => exercises.id, { onDelete: 'set null' }),
  set: integer('set'),
  round: integer('round'),
  reps: integer('reps'),
  kg: real('kg'),
  seconds: real('seconds'),
  meters: real('meters'),
  rpe: real('rpe'),
  ...timestamps,
}, t => [
  uniqueIndex('entry_logs_session_key_unique').on(t.sessionId, t.idempotencyKey),
  index('entry_logs_team_idx').on(t.teamId),
  index('entry_logs_athlete_exercise_idx').on(t.athleteId, t.exerciseId),
  index('entry_logs_exercise_idx').on(t.exerciseId),
])

export const painFlags = sqliteTable('pain_flags', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  athleteId: integer('athlete_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  sessionId: integer('session_id').notNull().references(() => sessionLogs.id, { onDelete: 'cascade' }),
  pain: integer('pain').notNull(),
  area: text('area'),
  reason: text('reason', { enum: painFlagReasons.values }).notNull(),
  sudden: integer('sudden', { mode: 'boolean' }).notNull().default(false),
  status: text('status', { enum: painFlagStatuses.values }).notNull().default('open'),
  reply: text('reply'),
  acknowledgedById: integer('acknowledged_by_id').references(() => users.id, { onDelete: 'set null' }),
  acknowledgedAt: integer('acknowledged_at', { mode: 'timestamp_ms' }),
  ...timestamps,
}, t => [
  index('pain_flags_team_status_idx').on(t.teamId, t.status),
  index('pain_flags_athlete_idx').on(t.athleteId),
  index('pain_flags_session_idx').on(t.sessionId),
  index('pain_flags_acknowledged_by_idx').on(t.acknowledgedById),
])

/** One row per background job: whichever app process holds the lease runs the job for that interval. */
export const jobLeases = sqliteTable('job_leases', {
  name: text('name').primaryKey(),
  holder: text('holder').notNull(),
  expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
  runs: integer('runs').notNull().default(0),
  lastRunAt: integer('last_run_at', { mode: 'timestamp_ms' }),
})
