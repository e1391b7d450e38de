import { sql } from 'drizzle-orm'
import { index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core'
import type { RoutineStep } from '#shared/schemas/routine-steps'
import type { AssignmentSnapshot, ExerciseCaution } from '#shared/types/domain'

const timestamps = {
  createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch('subsec') * 1000)`),
  updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch('subsec') * 1000)`).$onUpdate(() => new Date()),
}

export const roles = ['head_coach', 'coach', 'athlete'] as const
export const exerciseCategories = ['strength', 'hill', 'drill', 'stride', 'mobility', 'plyometric'] as const
export const routineCategories = ['strength', 'hills', 'drills', 'mixed'] as const
export const assignmentStatuses = ['planned', 'done', 'partial', 'skipped'] as const

export const teams = sqliteTable('teams', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  name: text('name').notNull(),
  ...timestamps,
})

export const users = sqliteTable('users', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  email: text('email').notNull(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  timezone: text('timezone').notNull().default('UTC'),
  notifyByEmail: integer('notify_by_email', { mode: 'boolean' }).notNull().default(true),
  ...timestamps,
}, t => [uniqueIndex('users_email_unique').on(t.email)])

export const memberships = sqliteTable('memberships', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  role: text('role', { enum: roles }).notNull(),
  ...timestamps,
}, t => [
  uniqueIndex('memberships_team_user_unique').on(t.teamId, t.userId),
  index('memberships_user_idx').on(t.userId),
  index('memberships_team_role_idx').on(t.teamId, t.role),
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
  ...timestamps,
}, t => [index('athlete_profiles_team_idx').on(t.teamId)])

export const injuryNotes = sqliteTable('injury_notes', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  athleteId: integer('athlete_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  bodyArea: text('body_area').notNull(),
  status: text('status', { enum: ['active', 'resolved'] }).notNull().default('active'),
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
  role: text('role', { enum: ['coach', 'athlete'] }).notNull(),
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
  category: text('category', { enum: exerciseCategories }).notNull(),
  summary: text('summary').notNull().default(''),
  cues: text('cues', { mode: 'json' }).notNull().$type<string[]>().default(sql`'[]'`),
  equipment: text('equipment', { mode: 'json' }).notNull().$type<string[]>().default(sql`'[]'`),
  cautions: text('cautions', { mode: 'json' }).notNull().$type<ExerciseCaution[]>().default(sql`'[]'`),
  clipId: integer('clip_id').references(() => mediaObjects.id, { onDelete: 'set null' }),
  posterId: integer('poster_id').references(() => mediaObjects.id, { onDelete: 'set null' }),
  archivedAt: integer('archived_at', { mode: 'timestamp_ms' }),
  createdById: integer('created_by_id').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  index('exercises_team_category_idx').on(t.teamId, t.category),
  index('exercises_team_name_idx').on(t.teamId, t.name),
  index('exercises_clip_idx').on(t.clipId),
  index('exercises_poster_idx').on(t.posterId),
  index('exercises_created_by_idx').on(t.createdById),
  index('exercises_archived_idx').on(t.teamId, t.archivedAt),
])

export const routines = sqliteTable('routines', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  teamId: integer('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
  title: text('title').notNull(),
  category: text('category', { enum: routineCategories }).notNull(),
  description: text('description').notNull().default(''),
  steps: text('steps', { mode: 'json' }).notNull().$type<RoutineStep[]>(),
  version: integer('version').notNull().default(1),
  isTemplate: integer('is_template', { mode: 'boolean' }).notNull().default(false),
  archivedAt: integer('archived_at', { mode: 'timestamp_ms' }),
  createdById: integer('created_by_id').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
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
  ...timestamps,
}, t => [
  index('assignments_team_date_idx').on(t.teamId, t.date),
  index('assignments_athlete_date_idx').on(t.athleteId, t.date),
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
  note: text('note').notNull().default(''),
  ...timestamps,
}, t => [
  uniqueIndex('session_logs_athlete_client_unique').on(t.athleteId, t.clientId),
  index('session_logs_assignment_idx').on(t.assignmentId),
  index('session_logs_athlete_day_idx').on(t.athleteId, t.day),
  index('session_logs_team_day_idx').on(t.teamId, t.day),
  // Covers the insights query (team, date range → athlete, load) so it never reads the table rows.
  index('session_logs_team_day_load_idx').on(t.teamId, t.day, t.athleteId, t.load),
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
  reason: text('reason', { enum: ['high_pain', 'new_area'] }).notNull(),
  status: text('status', { enum: ['open', 'acknowledged'] }).notNull().default('open'),
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
