CREATE TABLE `assignment_batches` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`idempotency_key` text NOT NULL,
	`result` text,
	`created_by_id` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `assignment_batches_team_key_unique` ON `assignment_batches` (`team_id`,`idempotency_key`);--> statement-breakpoint
CREATE INDEX `assignment_batches_created_by_idx` ON `assignment_batches` (`created_by_id`);--> statement-breakpoint
ALTER TABLE `exercises` ADD `starter_key` text;--> statement-breakpoint
CREATE UNIQUE INDEX `exercises_team_starter_unique` ON `exercises` (`team_id`,`starter_key`);--> statement-breakpoint
ALTER TABLE `routines` ADD `starter_key` text;--> statement-breakpoint
CREATE UNIQUE INDEX `routines_team_starter_unique` ON `routines` (`team_id`,`starter_key`);--> statement-breakpoint
ALTER TABLE `teams` ADD `timezone` text DEFAULT 'UTC' NOT NULL;--> statement-breakpoint
ALTER TABLE `teams` ADD `checklist_dismissed_at` integer;--> statement-breakpoint
ALTER TABLE `users` ADD `welcomed_at` integer;