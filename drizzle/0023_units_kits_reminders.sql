CREATE TABLE `service_intervals` (
	`bearing` text NOT NULL,
	`application` text NOT NULL,
	`months` integer NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`updated_by` text,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	PRIMARY KEY(`bearing`, `application`),
	FOREIGN KEY (`updated_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null,
	CONSTRAINT "service_intervals_bearing_ck" CHECK(bearing IN ('journal', 'ball')),
	CONSTRAINT "service_intervals_application_ck" CHECK(application IN ('street', 'circuit', 'drag', 'offroad', 'marine')),
	CONSTRAINT "service_intervals_months_ck" CHECK(months BETWEEN 1 AND 60)
);
--> statement-breakpoint
CREATE INDEX `service_intervals_updated_by_idx` ON `service_intervals` (`updated_by`);--> statement-breakpoint
CREATE TABLE `service_reminders` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`unit_id` integer NOT NULL,
	`due_on` text NOT NULL,
	`mail_id` integer,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`unit_id`) REFERENCES `units`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`mail_id`) REFERENCES `mail_outbox`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `service_reminders_unit_due_uq` ON `service_reminders` (`unit_id`,`due_on`);--> statement-breakpoint
CREATE INDEX `service_reminders_mail_idx` ON `service_reminders` (`mail_id`);--> statement-breakpoint
PRAGMA foreign_keys=OFF;--> statement-breakpoint
CREATE TABLE `__new_mail_outbox` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`kind` text NOT NULL,
	`recipient` text NOT NULL,
	`subject` text NOT NULL,
	`text` text NOT NULL,
	`html` text NOT NULL,
	`state` text DEFAULT 'queued' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`next_attempt_at` integer NOT NULL,
	`claimed_by` text,
	`claim_expires_at` integer,
	`last_error` text,
	`last_attempt_at` text,
	`sent_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	CONSTRAINT "mail_outbox_kind_ck" CHECK(kind IN ('order-confirmation', 'payment-failed', 'back-order', 'short-pick', 'dispatch', 'return-decision', 'dealer-application-received', 'dealer-approved', 'dealer-declined', 'password-reset', 'account-confirm', 'existing-account-notice', 'order-changed', 'service-reminder')),
	CONSTRAINT "mail_outbox_state_ck" CHECK(state IN ('queued', 'sending', 'sent', 'failed')),
	CONSTRAINT "mail_outbox_attempts_ck" CHECK(attempts >= 0),
	CONSTRAINT "mail_outbox_sent_ck" CHECK(state <> 'sent' OR sent_at IS NOT NULL)
);
--> statement-breakpoint
INSERT INTO `__new_mail_outbox`("id", "kind", "recipient", "subject", "text", "html", "state", "attempts", "next_attempt_at", "claimed_by", "claim_expires_at", "last_error", "last_attempt_at", "sent_at", "created_at") SELECT "id", "kind", "recipient", "subject", "text", "html", "state", "attempts", "next_attempt_at", "claimed_by", "claim_expires_at", "last_error", "last_attempt_at", "sent_at", "created_at" FROM `mail_outbox`;--> statement-breakpoint
DROP TABLE `mail_outbox`;--> statement-breakpoint
ALTER TABLE `__new_mail_outbox` RENAME TO `mail_outbox`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
CREATE INDEX `mail_outbox_due_idx` ON `mail_outbox` (`state`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `mail_outbox_created_idx` ON `mail_outbox` (`created_at`);--> statement-breakpoint
CREATE TABLE `__new_notices` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` text NOT NULL,
	`order_id` integer,
	`kind` text NOT NULL,
	`title` text NOT NULL,
	`body` text NOT NULL,
	`link` text NOT NULL,
	`read_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "notices_kind_ck" CHECK(kind IN ('paid', 'on-account', 'picking', 'back-ordered', 'dispatched', 'return-decided', 'service-due'))
);
--> statement-breakpoint
INSERT INTO `__new_notices`("id", "user_id", "order_id", "kind", "title", "body", "link", "read_at", "created_at") SELECT "id", "user_id", "order_id", "kind", "title", "body", "link", "read_at", "created_at" FROM `notices`;--> statement-breakpoint
DROP TABLE `notices`;--> statement-breakpoint
ALTER TABLE `__new_notices` RENAME TO `notices`;--> statement-breakpoint
CREATE INDEX `notices_user_idx` ON `notices` (`user_id`,`id`);--> statement-breakpoint
CREATE INDEX `notices_unread_idx` ON `notices` (`user_id`,`read_at`);--> statement-breakpoint
CREATE INDEX `notices_order_idx` ON `notices` (`order_id`);--> statement-breakpoint
-- The part_specs triggers that write to parts would stop the rename below (SQLite checks every trigger naming the
-- table); they go for the rebuild and come back after it.
DROP TRIGGER `part_specs_bearing_insert`;--> statement-breakpoint
DROP TRIGGER `part_specs_bearing_update`;--> statement-breakpoint
DROP TRIGGER `part_specs_bearing_delete`;--> statement-breakpoint
CREATE TABLE `__new_parts` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`part_number` text NOT NULL,
	`normalized_number` text NOT NULL,
	`title` text NOT NULL,
	`category` text NOT NULL,
	`frame_code` text,
	`status` text DEFAULT 'active' NOT NULL,
	`condition` text DEFAULT 'new' NOT NULL,
	`price_cents` integer NOT NULL,
	`core_deposit_cents` integer DEFAULT 0 NOT NULL,
	`weight_grams` integer NOT NULL,
	`description` text DEFAULT '' NOT NULL,
	`superseded_by` text,
	`images` text DEFAULT '[]' NOT NULL,
	`min_stock` integer DEFAULT 0 NOT NULL,
	`available` integer DEFAULT 0 NOT NULL,
	`bearing` text,
	`gtin` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`frame_code`) REFERENCES `frames`(`code`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "parts_status_ck" CHECK(status IN ('active', 'superseded', 'discontinued')),
	CONSTRAINT "parts_condition_ck" CHECK(condition IN ('new', 'exchange')),
	CONSTRAINT "parts_category_ck" CHECK(category IN ('turbochargers', 'cartridges', 'compressor-housings', 'turbine-housings', 'gaskets-fittings', 'gauges-sensors', 'rebuild-kits')),
	CONSTRAINT "parts_money_ck" CHECK(price_cents >= 0 AND core_deposit_cents >= 0),
	CONSTRAINT "parts_counts_ck" CHECK(weight_grams >= 0 AND min_stock >= 0 AND available >= 0)
);
--> statement-breakpoint
INSERT INTO `__new_parts`("id", "part_number", "normalized_number", "title", "category", "frame_code", "status", "condition", "price_cents", "core_deposit_cents", "weight_grams", "description", "superseded_by", "images", "min_stock", "available", "bearing", "gtin", "created_at", "updated_at") SELECT "id", "part_number", "normalized_number", "title", "category", "frame_code", "status", "condition", "price_cents", "core_deposit_cents", "weight_grams", "description", "superseded_by", "images", "min_stock", "available", "bearing", "gtin", "created_at", "updated_at" FROM `parts`;--> statement-breakpoint
DROP TABLE `parts`;--> statement-breakpoint
ALTER TABLE `__new_parts` RENAME TO `parts`;--> statement-breakpoint
CREATE UNIQUE INDEX `parts_part_number_uq` ON `parts` (`part_number`);--> statement-breakpoint
CREATE UNIQUE INDEX `parts_gtin_uq` ON `parts` (`gtin`);--> statement-breakpoint
CREATE INDEX `parts_normalized_number_idx` ON `parts` (`normalized_number`);--> statement-breakpoint
CREATE INDEX `parts_frame_idx` ON `parts` (`frame_code`,`status`,`available`);--> statement-breakpoint
CREATE INDEX `parts_browse_order_idx` ON `parts` ((CASE category WHEN 'turbochargers' THEN 0 WHEN 'cartridges' THEN 1 WHEN 'compressor-housings' THEN 2 WHEN 'turbine-housings' THEN 3 WHEN 'gaskets-fittings' THEN 4 WHEN 'gauges-sensors' THEN 5 WHEN 'rebuild-kits' THEN 6 ELSE 7 END),`frame_code`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_category_browse_idx` ON `parts` (`category`,`frame_code`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_frame_browse_idx` ON `parts` (`frame_code`,(CASE category WHEN 'turbochargers' THEN 0 WHEN 'cartridges' THEN 1 WHEN 'compressor-housings' THEN 2 WHEN 'turbine-housings' THEN 3 WHEN 'gaskets-fittings' THEN 4 WHEN 'gauges-sensors' THEN 5 WHEN 'rebuild-kits' THEN 6 ELSE 7 END),`part_number`);--> statement-breakpoint
CREATE INDEX `parts_price_idx` ON `parts` (`price_cents`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_category_price_idx` ON `parts` (`category`,`price_cents`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_frame_price_idx` ON `parts` (`frame_code`,`price_cents`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_category_number_idx` ON `parts` (`category`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_frame_number_idx` ON `parts` (`frame_code`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_title_idx` ON `parts` (`title`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_category_title_idx` ON `parts` (`category`,`title`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_frame_title_idx` ON `parts` (`frame_code`,`title`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_bearing_browse_idx` ON `parts` (`bearing`,(CASE category WHEN 'turbochargers' THEN 0 WHEN 'cartridges' THEN 1 WHEN 'compressor-housings' THEN 2 WHEN 'turbine-housings' THEN 3 WHEN 'gaskets-fittings' THEN 4 WHEN 'gauges-sensors' THEN 5 WHEN 'rebuild-kits' THEN 6 ELSE 7 END),`frame_code`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_bearing_price_idx` ON `parts` (`bearing`,`price_cents`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_bearing_number_idx` ON `parts` (`bearing`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_bearing_title_idx` ON `parts` (`bearing`,`title`,`part_number`);--> statement-breakpoint
ALTER TABLE `shaft_logs` ADD `unit_id` integer REFERENCES units(id) ON DELETE set null;--> statement-breakpoint
CREATE INDEX `shaft_logs_unit_idx` ON `shaft_logs` (`unit_id`,`created_at`);
--> statement-breakpoint
-- Rebuilding `parts` (its category CHECK gained rebuild-kits) dropped the triggers earlier hand-written migrations put on
-- it (0007: the change log and the stock version; 0014: the bearing copy and catalog_counts). They come back exactly as
-- they were; catalog_counts is counted again from the parts themselves, so it is right whatever the copy did.
CREATE TRIGGER `parts_changed_insert` AFTER INSERT ON `parts` BEGIN INSERT INTO `part_changes` (`part_id`) VALUES (new.`id`); END;
--> statement-breakpoint
CREATE TRIGGER `parts_changed_update` AFTER UPDATE OF `part_number`, `normalized_number`, `title`, `category`, `frame_code`, `status`, `condition`, `price_cents`, `core_deposit_cents`, `weight_grams`, `description`, `superseded_by`, `images`, `min_stock` ON `parts` BEGIN INSERT INTO `part_changes` (`part_id`) VALUES (new.`id`); END;
--> statement-breakpoint
CREATE TRIGGER `parts_changed_delete` AFTER DELETE ON `parts` BEGIN INSERT INTO `part_changes` (`part_id`) VALUES (old.`id`); END;
--> statement-breakpoint
CREATE TRIGGER `parts_available_changed` AFTER UPDATE OF `available` ON `parts` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'stock'; END;
--> statement-breakpoint
CREATE TRIGGER `parts_bearing_on_insert` AFTER INSERT ON `parts` BEGIN
  UPDATE `parts` SET `bearing` = (SELECT `bearing` FROM `part_specs` WHERE `part_id` = new.`id`)
  WHERE `id` = new.`id` AND `bearing` IS NOT (SELECT `bearing` FROM `part_specs` WHERE `part_id` = new.`id`);
END;
--> statement-breakpoint
CREATE TRIGGER `catalog_counts_part_insert` AFTER INSERT ON `parts` BEGIN
  INSERT INTO `catalog_counts` (`category`, `frame_code`, `bearing`, `status`, `in_stock`, `part_count`)
  VALUES (new.`category`, COALESCE(new.`frame_code`, ''), COALESCE(new.`bearing`, ''), new.`status`, new.`available` > 0, 1)
  ON CONFLICT (`category`, `frame_code`, `bearing`, `status`, `in_stock`) DO UPDATE SET `part_count` = `part_count` + 1;
END;
--> statement-breakpoint
CREATE TRIGGER `catalog_counts_part_delete` AFTER DELETE ON `parts` BEGIN
  UPDATE `catalog_counts` SET `part_count` = `part_count` - 1
  WHERE `category` = old.`category` AND `frame_code` = COALESCE(old.`frame_code`, '') AND `bearing` = COALESCE(old.`bearing`, '')
    AND `status` = old.`status` AND `in_stock` = (old.`available` > 0);
END;
--> statement-breakpoint
CREATE TRIGGER `catalog_counts_part_update` AFTER UPDATE OF `category`, `frame_code`, `bearing`, `status`, `available` ON `parts`
WHEN old.`category` IS NOT new.`category` OR old.`frame_code` IS NOT new.`frame_code` OR old.`bearing` IS NOT new.`bearing`
  OR old.`status` IS NOT new.`status` OR (old.`available` > 0) IS NOT (new.`available` > 0)
BEGIN
  UPDATE `catalog_counts` SET `part_count` = `part_count` - 1
  WHERE `category` = old.`category` AND `frame_code` = COALESCE(old.`frame_code`, '') AND `bearing` = COALESCE(old.`bearing`, '')
    AND `status` = old.`status` AND `in_stock` = (old.`available` > 0);
  INSERT INTO `catalog_counts` (`category`, `frame_code`, `bearing`, `status`, `in_stock`, `part_count`)
  VALUES (new.`category`, COALESCE(new.`frame_code`, ''), COALESCE(new.`bearing`, ''), new.`status`, new.`available` > 0, 1)
  ON CONFLICT (`category`, `frame_code`, `bearing`, `status`, `in_stock`) DO UPDATE SET `part_count` = `part_count` + 1;
END;
--> statement-breakpoint
CREATE TRIGGER `part_specs_bearing_insert` AFTER INSERT ON `part_specs` BEGIN
  UPDATE `parts` SET `bearing` = new.`bearing` WHERE `id` = new.`part_id` AND `bearing` IS NOT new.`bearing`;
END;
--> statement-breakpoint
CREATE TRIGGER `part_specs_bearing_update` AFTER UPDATE OF `bearing`, `part_id` ON `part_specs` BEGIN
  UPDATE `parts` SET `bearing` = NULL WHERE `id` = old.`part_id` AND old.`part_id` IS NOT new.`part_id`;
  UPDATE `parts` SET `bearing` = new.`bearing` WHERE `id` = new.`part_id` AND `bearing` IS NOT new.`bearing`;
END;
--> statement-breakpoint
CREATE TRIGGER `part_specs_bearing_delete` AFTER DELETE ON `part_specs` BEGIN
  UPDATE `parts` SET `bearing` = NULL WHERE `id` = old.`part_id` AND `bearing` IS NOT NULL;
END;
--> statement-breakpoint
DELETE FROM `catalog_counts`;
--> statement-breakpoint
INSERT INTO `catalog_counts` (`category`, `frame_code`, `bearing`, `status`, `in_stock`, `part_count`)
SELECT `category`, COALESCE(`frame_code`, ''), COALESCE(`bearing`, ''), `status`, `available` > 0, count(*) FROM `parts` GROUP BY 1, 2, 3, 4, 5;
--> statement-breakpoint
-- Service intervals by bearing and use (common practice, our reading; docs/decisions/0012-serials-logs-reminders.md).
INSERT INTO `service_intervals` (`bearing`, `application`, `months`, `note`) VALUES
  ('journal', 'circuit', 3, 'Journal thrust bearings wear fast in hard use: a freshen-up a few times a season (common practice).'),
  ('journal', 'drag', 3, 'Journal thrust bearings wear fast in hard use: a freshen-up a few times a season (common practice).'),
  ('journal', 'offroad', 6, 'Dust, heat and long full-load climbs: twice a year, between street and competition use (our choice).'),
  ('journal', 'marine', 6, 'Long hours near full load and salt air: twice a year, before and after the boating season (our choice).'),
  ('journal', 'street', 12, 'Road use is light on the bearings: a yearly check (our choice).'),
  ('ball', 'circuit', 12, 'Ball bearing units usually get a check at the end of each season (common practice).'),
  ('ball', 'drag', 12, 'Ball bearing units usually get a check at the end of each season (common practice).'),
  ('ball', 'offroad', 12, 'A check at the end of each season, as for other hard use (our choice, following common practice).'),
  ('ball', 'marine', 12, 'A check once a year, at the end of the boating season (our choice).'),
  ('ball', 'street', 24, 'Road use is light on a ball bearing: a check every other year (our choice).');
--> statement-breakpoint
-- The GTIN triggers (the fill for a part inserted without one and the two format checks, from the GTIN migration) went
-- with the rebuild too, and come back as they were.
CREATE TRIGGER `parts_gtin_fill` AFTER INSERT ON `parts` WHEN new.`gtin` IS NULL BEGIN
  UPDATE `parts` SET `gtin` = ('24731' || printf('%07d', new.`id`)) || ((10 - ((CAST(substr(('24731' || printf('%07d', new.`id`)), 1, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 3, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 5, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 7, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 9, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 11, 1) AS INTEGER) + 3 * (CAST(substr(('24731' || printf('%07d', new.`id`)), 2, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 4, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 6, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 8, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 10, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 12, 1) AS INTEGER))) % 10)) % 10) WHERE `id` = new.`id`;
END;
--> statement-breakpoint
CREATE TRIGGER `parts_gtin_insert_ck` BEFORE INSERT ON `parts` WHEN new.`gtin` IS NOT NULL AND (length(new.`gtin`) != 13 OR new.`gtin` GLOB '*[^0-9]*') BEGIN
  SELECT RAISE(ABORT, 'a GTIN is 13 digits');
END;
--> statement-breakpoint
CREATE TRIGGER `parts_gtin_update_ck` BEFORE UPDATE OF `gtin` ON `parts` WHEN new.`gtin` IS NULL OR length(new.`gtin`) != 13 OR new.`gtin` GLOB '*[^0-9]*' BEGIN
  SELECT RAISE(ABORT, 'a GTIN is 13 digits');
END;
