-- The project list sorts by total on an index: projects.latest_total_cents (the latest revision, the owner's view)
-- and projects.sent_total_cents (the latest revision that is not a draft, a client's view) follow the estimates
-- table through these triggers, so no service has to remember them. 0 while there is none.
CREATE TRIGGER `estimates_totals_insert` AFTER INSERT ON `estimates` BEGIN
  UPDATE `projects` SET
    `latest_total_cents` = ifnull((SELECT `total_cents` FROM `estimates` WHERE `project_id` = NEW.`project_id` ORDER BY `revision` DESC LIMIT 1), 0),
    `sent_total_cents` = ifnull((SELECT `total_cents` FROM `estimates` WHERE `project_id` = NEW.`project_id` AND `status` <> 'draft' ORDER BY `revision` DESC LIMIT 1), 0)
  WHERE `id` = NEW.`project_id`;
END;--> statement-breakpoint
CREATE TRIGGER `estimates_totals_update` AFTER UPDATE OF `total_cents`, `status`, `revision`, `project_id` ON `estimates` BEGIN
  UPDATE `projects` SET
    `latest_total_cents` = ifnull((SELECT `total_cents` FROM `estimates` WHERE `project_id` = `projects`.`id` ORDER BY `revision` DESC LIMIT 1), 0),
    `sent_total_cents` = ifnull((SELECT `total_cents` FROM `estimates` WHERE `project_id` = `projects`.`id` AND `status` <> 'draft' ORDER BY `revision` DESC LIMIT 1), 0)
  WHERE `id` IN (NEW.`project_id`, OLD.`project_id`);
END;--> statement-breakpoint
CREATE TRIGGER `estimates_totals_delete` AFTER DELETE ON `estimates` BEGIN
  UPDATE `projects` SET
    `latest_total_cents` = ifnull((SELECT `total_cents` FROM `estimates` WHERE `project_id` = OLD.`project_id` ORDER BY `revision` DESC LIMIT 1), 0),
    `sent_total_cents` = ifnull((SELECT `total_cents` FROM `estimates` WHERE `project_id` = OLD.`project_id` AND `status` <> 'draft' ORDER BY `revision` DESC LIMIT 1), 0)
  WHERE `id` = OLD.`project_id`;
END;--> statement-breakpoint
UPDATE `projects` SET
  `latest_total_cents` = ifnull((SELECT `total_cents` FROM `estimates` WHERE `project_id` = `projects`.`id` ORDER BY `revision` DESC LIMIT 1), 0),
  `sent_total_cents` = ifnull((SELECT `total_cents` FROM `estimates` WHERE `project_id` = `projects`.`id` AND `status` <> 'draft' ORDER BY `revision` DESC LIMIT 1), 0);
