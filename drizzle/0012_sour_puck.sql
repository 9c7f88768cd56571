ALTER TABLE `project_items` ADD `design` text DEFAULT '' NOT NULL;--> statement-breakpoint
UPDATE `project_items` SET `design` = coalesce(json_extract(`spec`, '$.design'), '');
--> statement-breakpoint
CREATE TRIGGER `project_items_design_insert` AFTER INSERT ON `project_items` BEGIN
  UPDATE `project_items` SET `design` = coalesce(json_extract(NEW.`spec`, '$.design'), '') WHERE `id` = NEW.`id`;
END;
--> statement-breakpoint
CREATE TRIGGER `project_items_design_update` AFTER UPDATE OF `spec` ON `project_items` BEGIN
  UPDATE `project_items` SET `design` = coalesce(json_extract(NEW.`spec`, '$.design'), '') WHERE `id` = NEW.`id`;
END;
