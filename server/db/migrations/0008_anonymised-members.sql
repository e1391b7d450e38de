CREATE TABLE `anonymised_members` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`user_id` integer NOT NULL,
	`number` integer NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `anonymised_members_team_user_unique` ON `anonymised_members` (`team_id`,`user_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `anonymised_members_team_number_unique` ON `anonymised_members` (`team_id`,`number`);--> statement-breakpoint
CREATE INDEX `anonymised_members_user_idx` ON `anonymised_members` (`user_id`);