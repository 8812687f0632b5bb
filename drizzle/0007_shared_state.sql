-- State that several app processes on one database share (docs/decisions/0005-several-processes.md): change
-- counters and a log of changed parts kept by triggers, so every process's caches and search index follow writes made
-- by any process ('search' moves when the search index's own tables are rewritten); rate-limit counters; leases for
-- scheduled jobs.
CREATE TABLE `change_versions` (
	`topic` text PRIMARY KEY NOT NULL,
	`version` integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
CREATE TABLE `job_leases` (
	`name` text PRIMARY KEY NOT NULL,
	`holder` text NOT NULL,
	`expires_at` integer NOT NULL,
	`last_run_at` integer
);
--> statement-breakpoint
CREATE TABLE `part_changes` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`part_id` integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE `rate_limit_hits` (
	`key` text PRIMARY KEY NOT NULL,
	`window_ends_at` integer NOT NULL,
	`hits` integer NOT NULL
);
--> statement-breakpoint
INSERT INTO `change_versions` (`topic`, `version`) VALUES ('stock', 0), ('frames', 0), ('search', 0);
--> statement-breakpoint
-- A part's catalogue data changed (every column but `available`, which follows stock: that moves the stock counter).
-- A column added to `parts` later belongs in this list unless it is stock.
CREATE TRIGGER `parts_changed_insert` AFTER INSERT ON `parts` BEGIN INSERT INTO `part_changes` (`part_id`) VALUES (new.`id`); END;
--> statement-breakpoint
CREATE TRIGGER `parts_changed_update` AFTER UPDATE OF `part_number`, `normalized_number`, `title`, `category`, `frame_code`, `status`, `condition`, `price_cents`, `core_deposit_cents`, `weight_grams`, `description`, `superseded_by`, `images`, `min_stock` ON `parts` BEGIN INSERT INTO `part_changes` (`part_id`) VALUES (new.`id`); END;
--> statement-breakpoint
CREATE TRIGGER `parts_changed_delete` AFTER DELETE ON `parts` BEGIN INSERT INTO `part_changes` (`part_id`) VALUES (old.`id`); END;
--> statement-breakpoint
CREATE TRIGGER `parts_available_changed` AFTER UPDATE OF `available` ON `parts` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'stock'; END;
--> statement-breakpoint
CREATE TRIGGER `part_specs_changed_insert` AFTER INSERT ON `part_specs` BEGIN INSERT INTO `part_changes` (`part_id`) VALUES (new.`part_id`); END;
--> statement-breakpoint
CREATE TRIGGER `part_specs_changed_update` AFTER UPDATE ON `part_specs` BEGIN INSERT INTO `part_changes` (`part_id`) VALUES (new.`part_id`); END;
--> statement-breakpoint
CREATE TRIGGER `part_specs_changed_delete` AFTER DELETE ON `part_specs` BEGIN INSERT INTO `part_changes` (`part_id`) VALUES (old.`part_id`); END;
--> statement-breakpoint
CREATE TRIGGER `part_aliases_changed_insert` AFTER INSERT ON `part_aliases` BEGIN INSERT INTO `part_changes` (`part_id`) VALUES (new.`part_id`); END;
--> statement-breakpoint
CREATE TRIGGER `part_aliases_changed_update` AFTER UPDATE ON `part_aliases` BEGIN INSERT INTO `part_changes` (`part_id`) VALUES (new.`part_id`); END;
--> statement-breakpoint
CREATE TRIGGER `part_aliases_changed_delete` AFTER DELETE ON `part_aliases` BEGIN INSERT INTO `part_changes` (`part_id`) VALUES (old.`part_id`); END;
--> statement-breakpoint
CREATE TRIGGER `frames_changed_insert` AFTER INSERT ON `frames` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'frames'; END;
--> statement-breakpoint
CREATE TRIGGER `frames_changed_update` AFTER UPDATE ON `frames` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'frames'; END;
--> statement-breakpoint
CREATE TRIGGER `frames_changed_delete` AFTER DELETE ON `frames` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'frames'; END;
