CREATE INDEX `project_events_project_created` ON `project_events` (`project_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `projects_client_updated` ON `projects` (`client_id`,`updated_at`);--> statement-breakpoint
CREATE INDEX `users_role_name_nocase` ON `users` (`role`,"name" collate nocase,`id`);