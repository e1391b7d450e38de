CREATE TABLE `job_leases` (
	`name` text PRIMARY KEY NOT NULL,
	`holder` text NOT NULL,
	`expires_at` integer NOT NULL,
	`runs` integer DEFAULT 0 NOT NULL,
	`last_run_at` integer
);
