CREATE TABLE `job_layouts` (
	`id` text PRIMARY KEY NOT NULL,
	`job_id` text NOT NULL,
	`actor_id` text,
	`record` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `job_layouts_job` ON `job_layouts` (`job_id`);--> statement-breakpoint
CREATE TABLE `revision_records` (
	`estimate_id` text PRIMARY KEY NOT NULL,
	`record` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`estimate_id`) REFERENCES `estimates`(`id`) ON UPDATE no action ON DELETE cascade
);
