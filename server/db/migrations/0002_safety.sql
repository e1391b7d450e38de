ALTER TABLE `athlete_profiles` ADD `guardian_contact` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `memberships` ADD `pain_flag_emails` integer DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE `pain_flags` ADD `sudden` integer DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `session_logs` ADD `pain_sudden` integer DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `teams` ADD `emergency_number` text;