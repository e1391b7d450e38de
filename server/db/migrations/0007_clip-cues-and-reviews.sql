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
CREATE TABLE `form_review_comments` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`review_id` integer NOT NULL,
	`author_id` integer,
	`at_seconds` real NOT NULL,
	`text` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`review_id`) REFERENCES `form_reviews`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `form_review_comments_review_idx` ON `form_review_comments` (`review_id`,`at_seconds`);--> statement-breakpoint
CREATE INDEX `form_review_comments_team_idx` ON `form_review_comments` (`team_id`);--> statement-breakpoint
CREATE INDEX `form_review_comments_author_idx` ON `form_review_comments` (`author_id`);--> statement-breakpoint
CREATE TABLE `form_reviews` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`athlete_id` integer NOT NULL,
	`clip_id` integer NOT NULL,
	`question` text DEFAULT '' NOT NULL,
	`assignment_id` integer,
	`step_id` text,
	`exercise_id` integer,
	`reply_clip_id` integer,
	`status` text DEFAULT 'open' NOT NULL,
	`answered_at` integer,
	`answered_by_id` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`athlete_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`clip_id`) REFERENCES `media_objects`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`assignment_id`) REFERENCES `assignments`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`reply_clip_id`) REFERENCES `media_objects`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`answered_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `form_reviews_team_status_idx` ON `form_reviews` (`team_id`,`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `form_reviews_athlete_idx` ON `form_reviews` (`athlete_id`);--> statement-breakpoint
CREATE INDEX `form_reviews_clip_idx` ON `form_reviews` (`clip_id`);--> statement-breakpoint
CREATE INDEX `form_reviews_reply_clip_idx` ON `form_reviews` (`reply_clip_id`);--> statement-breakpoint
CREATE INDEX `form_reviews_assignment_idx` ON `form_reviews` (`assignment_id`);--> statement-breakpoint
CREATE INDEX `form_reviews_exercise_idx` ON `form_reviews` (`exercise_id`);--> statement-breakpoint
CREATE INDEX `form_reviews_answered_by_idx` ON `form_reviews` (`answered_by_id`);--> statement-breakpoint
ALTER TABLE `media_objects` ADD `duration_seconds` real;--> statement-breakpoint
ALTER TABLE `media_objects` ADD `width` integer;--> statement-breakpoint
ALTER TABLE `media_objects` ADD `height` integer;--> statement-breakpoint
ALTER TABLE `teams` ADD `review_retention_days` integer DEFAULT 180 NOT NULL;