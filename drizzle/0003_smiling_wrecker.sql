ALTER TABLE `uploads` ADD `kind` text DEFAULT 'image' NOT NULL;--> statement-breakpoint
ALTER TABLE `uploads` ADD `thumbnail_path` text;--> statement-breakpoint
ALTER TABLE `uploads` ADD `stage_key` text;--> statement-breakpoint
CREATE INDEX `uploads_project` ON `uploads` (`project_id`);