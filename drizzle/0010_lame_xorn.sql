ALTER TABLE `project_events` ADD `stage_key` text;--> statement-breakpoint
ALTER TABLE `project_events` ADD `upload_id` text;--> statement-breakpoint
ALTER TABLE `sessions` ADD `user_agent` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `sessions` ADD `last_seen_at` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `users` ADD `pending_email` text;