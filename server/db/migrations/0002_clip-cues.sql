CREATE TABLE `clip_cues` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`exercise_id` integer NOT NULL,
	`start_seconds` real NOT NULL,
	`end_seconds` real,
	`text` text NOT NULL,
	`created_by_id` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `clip_cues_exercise_idx` ON `clip_cues` (`exercise_id`,`start_seconds`);--> statement-breakpoint
CREATE INDEX `clip_cues_team_idx` ON `clip_cues` (`team_id`);--> statement-breakpoint
CREATE INDEX `clip_cues_created_by_idx` ON `clip_cues` (`created_by_id`);--> statement-breakpoint
ALTER TABLE `media_objects` ADD `duration_seconds` real;--> statement-breakpoint
ALTER TABLE `media_objects` ADD `width` integer;--> statement-breakpoint
ALTER TABLE `media_objects` ADD `height` integer;