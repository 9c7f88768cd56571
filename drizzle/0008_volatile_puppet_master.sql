DROP INDEX `projects_client`;--> statement-breakpoint
DROP INDEX `projects_status`;--> statement-breakpoint
ALTER TABLE `projects` ADD `latest_total_cents` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `projects` ADD `sent_total_cents` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `projects` ADD `status_rank` integer GENERATED ALWAYS AS ((CASE "status" WHEN 'requested' THEN 0 WHEN 'estimating' THEN 1 WHEN 'estimate_sent' THEN 2 WHEN 'accepted' THEN 3 WHEN 'deposit_paid' THEN 4 WHEN 'in_production' THEN 5 WHEN 'ready' THEN 6 WHEN 'delivered' THEN 7 WHEN 'closed' THEN 8 WHEN 'declined' THEN 9 WHEN 'expired' THEN 10 WHEN 'cancelled' THEN 11 END)) VIRTUAL;--> statement-breakpoint
CREATE INDEX `projects_client_created` ON `projects` (`client_id`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `projects_client_id` ON `projects` (`client_id`,`id`);--> statement-breakpoint
CREATE INDEX `projects_status_created` ON `projects` (`status`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `projects_created` ON `projects` (`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `projects_updated` ON `projects` (`updated_at`,`id`);--> statement-breakpoint
CREATE INDEX `projects_status_rank` ON `projects` (`status_rank`,`id`);--> statement-breakpoint
CREATE INDEX `projects_latest_total` ON `projects` (`latest_total_cents`,`id`);--> statement-breakpoint
CREATE INDEX `projects_sent_total` ON `projects` (`sent_total_cents`,`id`);--> statement-breakpoint
CREATE INDEX `jobs_stage_updated` ON `jobs` (`stage_key`,`updated_at`,`id`);--> statement-breakpoint
CREATE INDEX `payments_created` ON `payments` (`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `payments_project` ON `payments` (`project_id`);--> statement-breakpoint
CREATE INDEX `project_items_project` ON `project_items` (`project_id`,`position`);--> statement-breakpoint
CREATE INDEX `time_entries_job` ON `time_entries` (`job_id`,`stage_key`);--> statement-breakpoint
CREATE INDEX `users_name` ON `users` (`name`,`id`);