CREATE TABLE `job_checks` (
	`job_id` text NOT NULL,
	`item_key` text NOT NULL,
	`user_id` text NOT NULL,
	`checked_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	PRIMARY KEY(`job_id`, `item_key`),
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
