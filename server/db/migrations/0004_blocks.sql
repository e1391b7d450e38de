CREATE TABLE `block_routines` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`block_id` integer NOT NULL,
	`routine_id` integer NOT NULL,
	`weekday` integer NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	`rules` text DEFAULT '[]' NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	FOREIGN KEY (`block_id`) REFERENCES `blocks`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`routine_id`) REFERENCES `routines`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `block_routines_block_idx` ON `block_routines` (`block_id`);--> statement-breakpoint
CREATE INDEX `block_routines_routine_idx` ON `block_routines` (`routine_id`);--> statement-breakpoint
CREATE TABLE `block_targets` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`block_id` integer NOT NULL,
	`athlete_id` integer,
	`squad_id` integer,
	FOREIGN KEY (`block_id`) REFERENCES `blocks`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`athlete_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`squad_id`) REFERENCES `squads`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `block_targets_block_idx` ON `block_targets` (`block_id`);--> statement-breakpoint
CREATE INDEX `block_targets_athlete_idx` ON `block_targets` (`athlete_id`);--> statement-breakpoint
CREATE INDEX `block_targets_squad_idx` ON `block_targets` (`squad_id`);--> statement-breakpoint
CREATE TABLE `block_week_overrides` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`block_id` integer NOT NULL,
	`block_routine_id` integer NOT NULL,
	`week` integer NOT NULL,
	`values` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`block_id`) REFERENCES `blocks`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`block_routine_id`) REFERENCES `block_routines`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `block_week_overrides_unique` ON `block_week_overrides` (`block_routine_id`,`week`);--> statement-breakpoint
CREATE INDEX `block_week_overrides_block_idx` ON `block_week_overrides` (`block_id`);--> statement-breakpoint
CREATE TABLE `blocks` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`name` text NOT NULL,
	`start_date` text NOT NULL,
	`weeks` integer NOT NULL,
	`goal_race_name` text,
	`goal_race_date` text,
	`goal_race_distance_m` real,
	`lighter` text,
	`taper` text,
	`note` text DEFAULT '' NOT NULL,
	`planned_at` integer,
	`revision` integer DEFAULT 1 NOT NULL,
	`planned_revision` integer,
	`created_by_id` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `blocks_team_start_idx` ON `blocks` (`team_id`,`start_date`);--> statement-breakpoint
CREATE INDEX `blocks_created_by_idx` ON `blocks` (`created_by_id`);--> statement-breakpoint
ALTER TABLE `assignments` ADD `block_id` integer REFERENCES blocks(id);--> statement-breakpoint
ALTER TABLE `assignments` ADD `block_week` integer;--> statement-breakpoint
ALTER TABLE `assignments` ADD `block_routine_id` integer;--> statement-breakpoint
CREATE INDEX `assignments_block_week_idx` ON `assignments` (`block_id`,`block_week`);--> statement-breakpoint
CREATE INDEX `assignments_block_routine_idx` ON `assignments` (`block_routine_id`);--> statement-breakpoint
ALTER TABLE `teams` ADD `plate_increment_kg` real DEFAULT 2.5 NOT NULL;