ALTER TABLE `revision_records` ADD `units` text DEFAULT 'in' NOT NULL;--> statement-breakpoint
UPDATE `revision_records` SET `units` = coalesce(json_extract(`record`, '$.settings.units'), 'in');