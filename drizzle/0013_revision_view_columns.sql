ALTER TABLE `project_items` ADD `design` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `revision_records` ADD `units` text DEFAULT 'in' NOT NULL;--> statement-breakpoint
ALTER TABLE `revision_records` ADD `choices` text DEFAULT '[]' NOT NULL;--> statement-breakpoint
-- filled from what each row already holds (hand-written after drizzle-kit's ALTERs)
UPDATE `revision_records` SET `units` = coalesce(json_extract(`record`, '$.settings.units'), 'in');--> statement-breakpoint
UPDATE `revision_records` SET `choices` = coalesce(json_extract(`record`, '$.choices'), '[]');--> statement-breakpoint
UPDATE `project_items` SET `design` = coalesce(json_extract(`spec`, '$.design'), '');--> statement-breakpoint
-- the list reads an item's design from its column; the triggers keep it in step with the spec, so no code path writes it
CREATE TRIGGER `project_items_design_insert` AFTER INSERT ON `project_items` BEGIN
  UPDATE `project_items` SET `design` = coalesce(json_extract(NEW.`spec`, '$.design'), '') WHERE `id` = NEW.`id`;
END;--> statement-breakpoint
CREATE TRIGGER `project_items_design_update` AFTER UPDATE OF `spec` ON `project_items` BEGIN
  UPDATE `project_items` SET `design` = coalesce(json_extract(NEW.`spec`, '$.design'), '') WHERE `id` = NEW.`id`;
END;
