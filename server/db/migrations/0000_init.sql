CREATE TABLE `assignment_series` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`routine_id` integer NOT NULL,
	`squad_id` integer,
	`start_date` text NOT NULL,
	`weeks` integer NOT NULL,
	`weekdays` text NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`created_by_id` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`routine_id`) REFERENCES `routines`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`squad_id`) REFERENCES `squads`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `assignment_series_team_idx` ON `assignment_series` (`team_id`);--> statement-breakpoint
CREATE INDEX `assignment_series_routine_idx` ON `assignment_series` (`routine_id`);--> statement-breakpoint
CREATE INDEX `assignment_series_squad_idx` ON `assignment_series` (`squad_id`);--> statement-breakpoint
CREATE INDEX `assignment_series_created_by_idx` ON `assignment_series` (`created_by_id`);--> statement-breakpoint
CREATE TABLE `assignments` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`athlete_id` integer NOT NULL,
	`routine_id` integer NOT NULL,
	`routine_version` integer NOT NULL,
	`snapshot` text NOT NULL,
	`date` text NOT NULL,
	`series_id` integer,
	`note` text DEFAULT '' NOT NULL,
	`status` text DEFAULT 'planned' NOT NULL,
	`assigned_by_id` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`athlete_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`routine_id`) REFERENCES `routines`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`series_id`) REFERENCES `assignment_series`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`assigned_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `assignments_team_date_idx` ON `assignments` (`team_id`,`date`);--> statement-breakpoint
CREATE INDEX `assignments_athlete_date_idx` ON `assignments` (`athlete_id`,`date`);--> statement-breakpoint
CREATE INDEX `assignments_routine_idx` ON `assignments` (`routine_id`);--> statement-breakpoint
CREATE INDEX `assignments_series_idx` ON `assignments` (`series_id`);--> statement-breakpoint
CREATE INDEX `assignments_assigned_by_idx` ON `assignments` (`assigned_by_id`);--> statement-breakpoint
CREATE TABLE `athlete_profiles` (
	`user_id` integer PRIMARY KEY NOT NULL,
	`team_id` integer NOT NULL,
	`benchmark_distance_m` real,
	`benchmark_time_s` real,
	`benchmark_date` text,
	`birth_year` integer,
	`hr_max` integer,
	`hr_rest` integer,
	`units` text DEFAULT 'km' NOT NULL,
	`goal` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `athlete_profiles_team_idx` ON `athlete_profiles` (`team_id`);--> statement-breakpoint
CREATE TABLE `calendar_feeds` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`user_id` integer NOT NULL,
	`token_hash` text NOT NULL,
	`revoked_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `calendar_feeds_token_unique` ON `calendar_feeds` (`token_hash`);--> statement-breakpoint
CREATE INDEX `calendar_feeds_user_idx` ON `calendar_feeds` (`user_id`);--> statement-breakpoint
CREATE INDEX `calendar_feeds_team_idx` ON `calendar_feeds` (`team_id`);--> statement-breakpoint
CREATE TABLE `email_outbox` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer,
	`to` text NOT NULL,
	`template` text NOT NULL,
	`payload` text NOT NULL,
	`status` text DEFAULT 'pending' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`last_error` text,
	`next_attempt_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`locked_until` integer,
	`sent_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `email_outbox_status_next_idx` ON `email_outbox` (`status`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `email_outbox_team_idx` ON `email_outbox` (`team_id`);--> statement-breakpoint
CREATE TABLE `entry_logs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`session_id` integer NOT NULL,
	`athlete_id` integer NOT NULL,
	`idempotency_key` text NOT NULL,
	`step_id` text NOT NULL,
	`exercise_id` integer,
	`set` integer,
	`round` integer,
	`reps` integer,
	`kg` real,
	`seconds` real,
	`meters` real,
	`rpe` real,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`session_id`) REFERENCES `session_logs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`athlete_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `entry_logs_session_key_unique` ON `entry_logs` (`session_id`,`idempotency_key`);--> statement-breakpoint
CREATE INDEX `entry_logs_team_idx` ON `entry_logs` (`team_id`);--> statement-breakpoint
CREATE INDEX `entry_logs_athlete_exercise_idx` ON `entry_logs` (`athlete_id`,`exercise_id`);--> statement-breakpoint
CREATE INDEX `entry_logs_exercise_idx` ON `entry_logs` (`exercise_id`);--> statement-breakpoint
CREATE TABLE `exercises` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`name` text NOT NULL,
	`category` text NOT NULL,
	`summary` text DEFAULT '' NOT NULL,
	`cues` text DEFAULT '[]' NOT NULL,
	`equipment` text DEFAULT '[]' NOT NULL,
	`cautions` text DEFAULT '[]' NOT NULL,
	`clip_id` integer,
	`poster_id` integer,
	`archived_at` integer,
	`created_by_id` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`clip_id`) REFERENCES `media_objects`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`poster_id`) REFERENCES `media_objects`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `exercises_team_category_idx` ON `exercises` (`team_id`,`category`);--> statement-breakpoint
CREATE INDEX `exercises_team_name_idx` ON `exercises` (`team_id`,`name`);--> statement-breakpoint
CREATE INDEX `exercises_clip_idx` ON `exercises` (`clip_id`);--> statement-breakpoint
CREATE INDEX `exercises_poster_idx` ON `exercises` (`poster_id`);--> statement-breakpoint
CREATE INDEX `exercises_created_by_idx` ON `exercises` (`created_by_id`);--> statement-breakpoint
CREATE INDEX `exercises_archived_idx` ON `exercises` (`team_id`,`archived_at`);--> statement-breakpoint
CREATE TABLE `injury_notes` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`athlete_id` integer NOT NULL,
	`body_area` text NOT NULL,
	`status` text DEFAULT 'active' NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`since` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`athlete_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `injury_notes_team_idx` ON `injury_notes` (`team_id`);--> statement-breakpoint
CREATE INDEX `injury_notes_athlete_status_idx` ON `injury_notes` (`athlete_id`,`status`);--> statement-breakpoint
CREATE TABLE `invites` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`email` text NOT NULL,
	`role` text NOT NULL,
	`squad_id` integer,
	`token_hash` text NOT NULL,
	`invited_by_id` integer NOT NULL,
	`expires_at` integer NOT NULL,
	`accepted_at` integer,
	`revoked_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`squad_id`) REFERENCES `squads`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`invited_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `invites_token_unique` ON `invites` (`token_hash`);--> statement-breakpoint
CREATE INDEX `invites_team_idx` ON `invites` (`team_id`);--> statement-breakpoint
CREATE INDEX `invites_squad_idx` ON `invites` (`squad_id`);--> statement-breakpoint
CREATE INDEX `invites_invited_by_idx` ON `invites` (`invited_by_id`);--> statement-breakpoint
CREATE INDEX `invites_email_idx` ON `invites` (`email`);--> statement-breakpoint
CREATE TABLE `login_failures` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`email` text NOT NULL,
	`ip` text NOT NULL,
	`at` integer NOT NULL
);
--> statement-breakpoint
CREATE INDEX `login_failures_email_at_idx` ON `login_failures` (`email`,`at`);--> statement-breakpoint
CREATE INDEX `login_failures_ip_at_idx` ON `login_failures` (`ip`,`at`);--> statement-breakpoint
CREATE TABLE `media_objects` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`exercise_id` integer,
	`key` text NOT NULL,
	`purpose` text DEFAULT 'clip' NOT NULL,
	`content_type` text NOT NULL,
	`size` integer NOT NULL,
	`status` text DEFAULT 'pending' NOT NULL,
	`created_by_id` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `media_objects_key_unique` ON `media_objects` (`key`);--> statement-breakpoint
CREATE INDEX `media_objects_team_status_idx` ON `media_objects` (`team_id`,`status`);--> statement-breakpoint
CREATE INDEX `media_objects_exercise_idx` ON `media_objects` (`exercise_id`);--> statement-breakpoint
CREATE INDEX `media_objects_created_by_idx` ON `media_objects` (`created_by_id`);--> statement-breakpoint
CREATE TABLE `memberships` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`user_id` integer NOT NULL,
	`role` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `memberships_team_user_unique` ON `memberships` (`team_id`,`user_id`);--> statement-breakpoint
CREATE INDEX `memberships_user_idx` ON `memberships` (`user_id`);--> statement-breakpoint
CREATE INDEX `memberships_team_role_idx` ON `memberships` (`team_id`,`role`);--> statement-breakpoint
CREATE TABLE `pain_flags` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`athlete_id` integer NOT NULL,
	`session_id` integer NOT NULL,
	`pain` integer NOT NULL,
	`area` text,
	`reason` text NOT NULL,
	`status` text DEFAULT 'open' NOT NULL,
	`reply` text,
	`acknowledged_by_id` integer,
	`acknowledged_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`athlete_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`session_id`) REFERENCES `session_logs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`acknowledged_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `pain_flags_team_status_idx` ON `pain_flags` (`team_id`,`status`);--> statement-breakpoint
CREATE INDEX `pain_flags_athlete_idx` ON `pain_flags` (`athlete_id`);--> statement-breakpoint
CREATE INDEX `pain_flags_session_idx` ON `pain_flags` (`session_id`);--> statement-breakpoint
CREATE INDEX `pain_flags_acknowledged_by_idx` ON `pain_flags` (`acknowledged_by_id`);--> statement-breakpoint
CREATE TABLE `password_resets` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` integer NOT NULL,
	`token_hash` text NOT NULL,
	`expires_at` integer NOT NULL,
	`used_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `password_resets_token_unique` ON `password_resets` (`token_hash`);--> statement-breakpoint
CREATE INDEX `password_resets_user_idx` ON `password_resets` (`user_id`);--> statement-breakpoint
CREATE TABLE `routine_exercises` (
	`routine_id` integer NOT NULL,
	`exercise_id` integer NOT NULL,
	PRIMARY KEY(`routine_id`, `exercise_id`),
	FOREIGN KEY (`routine_id`) REFERENCES `routines`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `routine_exercises_exercise_idx` ON `routine_exercises` (`exercise_id`);--> statement-breakpoint
CREATE TABLE `routines` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`title` text NOT NULL,
	`category` text NOT NULL,
	`description` text DEFAULT '' NOT NULL,
	`steps` text NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`is_template` integer DEFAULT false NOT NULL,
	`archived_at` integer,
	`created_by_id` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `routines_team_category_idx` ON `routines` (`team_id`,`category`);--> statement-breakpoint
CREATE INDEX `routines_team_title_idx` ON `routines` (`team_id`,`title`);--> statement-breakpoint
CREATE INDEX `routines_created_by_idx` ON `routines` (`created_by_id`);--> statement-breakpoint
CREATE TABLE `session_logs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`assignment_id` integer NOT NULL,
	`athlete_id` integer NOT NULL,
	`client_id` text NOT NULL,
	`started_at` integer NOT NULL,
	`finished_at` integer,
	`day` text NOT NULL,
	`duration_s` integer,
	`session_rpe` real,
	`load` real,
	`pain` integer,
	`pain_area` text,
	`note` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`assignment_id`) REFERENCES `assignments`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`athlete_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `session_logs_athlete_client_unique` ON `session_logs` (`athlete_id`,`client_id`);--> statement-breakpoint
CREATE INDEX `session_logs_assignment_idx` ON `session_logs` (`assignment_id`);--> statement-breakpoint
CREATE INDEX `session_logs_athlete_day_idx` ON `session_logs` (`athlete_id`,`day`);--> statement-breakpoint
CREATE INDEX `session_logs_team_day_idx` ON `session_logs` (`team_id`,`day`);--> statement-breakpoint
CREATE TABLE `squad_members` (
	`squad_id` integer NOT NULL,
	`user_id` integer NOT NULL,
	`joined_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	PRIMARY KEY(`squad_id`, `user_id`),
	FOREIGN KEY (`squad_id`) REFERENCES `squads`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `squad_members_user_idx` ON `squad_members` (`user_id`);--> statement-breakpoint
CREATE TABLE `squads` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`name` text NOT NULL,
	`description` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `squads_team_idx` ON `squads` (`team_id`);--> statement-breakpoint
CREATE TABLE `teams` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`email` text NOT NULL,
	`name` text NOT NULL,
	`password_hash` text NOT NULL,
	`timezone` text DEFAULT 'UTC' NOT NULL,
	`notify_by_email` integer DEFAULT true NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `users_email_unique` ON `users` (`email`);