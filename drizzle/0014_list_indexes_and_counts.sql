CREATE TABLE `catalog_counts` (
	`category` text NOT NULL,
	`frame_code` text NOT NULL,
	`bearing` text NOT NULL,
	`status` text NOT NULL,
	`in_stock` integer NOT NULL,
	`part_count` integer NOT NULL,
	PRIMARY KEY(`category`, `frame_code`, `bearing`, `status`, `in_stock`)
);
--> statement-breakpoint
DROP INDEX `parts_listing_idx`;--> statement-breakpoint
ALTER TABLE `parts` ADD `bearing` text;--> statement-breakpoint
CREATE INDEX `parts_category_browse_idx` ON `parts` (`category`,`frame_code`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_frame_browse_idx` ON `parts` (`frame_code`,(CASE category WHEN 'turbochargers' THEN 0 WHEN 'cartridges' THEN 1 WHEN 'compressor-housings' THEN 2 WHEN 'turbine-housings' THEN 3 WHEN 'gaskets-fittings' THEN 4 WHEN 'gauges-sensors' THEN 5 ELSE 6 END),`part_number`);--> statement-breakpoint
CREATE INDEX `parts_price_idx` ON `parts` (`price_cents`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_category_price_idx` ON `parts` (`category`,`price_cents`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_frame_price_idx` ON `parts` (`frame_code`,`price_cents`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_category_number_idx` ON `parts` (`category`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_frame_number_idx` ON `parts` (`frame_code`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_title_idx` ON `parts` (`title`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_category_title_idx` ON `parts` (`category`,`title`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_frame_title_idx` ON `parts` (`frame_code`,`title`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_bearing_browse_idx` ON `parts` (`bearing`,(CASE category WHEN 'turbochargers' THEN 0 WHEN 'cartridges' THEN 1 WHEN 'compressor-housings' THEN 2 WHEN 'turbine-housings' THEN 3 WHEN 'gaskets-fittings' THEN 4 WHEN 'gauges-sensors' THEN 5 ELSE 6 END),`frame_code`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_bearing_price_idx` ON `parts` (`bearing`,`price_cents`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_bearing_number_idx` ON `parts` (`bearing`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_bearing_title_idx` ON `parts` (`bearing`,`title`,`part_number`);--> statement-breakpoint
-- parts.bearing copies part_specs.bearing, written by these triggers only: the specs may be written before or after
-- their part, and a part's delete cascades to its specs after the part is gone (then there is nothing to copy to).
UPDATE `parts` SET `bearing` = (SELECT `bearing` FROM `part_specs` WHERE `part_id` = `parts`.`id`);
--> statement-breakpoint
CREATE TRIGGER `parts_bearing_on_insert` AFTER INSERT ON `parts` BEGIN
  UPDATE `parts` SET `bearing` = (SELECT `bearing` FROM `part_specs` WHERE `part_id` = new.`id`)
  WHERE `id` = new.`id` AND `bearing` IS NOT (SELECT `bearing` FROM `part_specs` WHERE `part_id` = new.`id`);
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
-- catalog_counts follows every change to a part's category, frame, bearing, status or stock (in or out), in the
-- statement that makes it, whichever process or tool writes.
INSERT INTO `catalog_counts` (`category`, `frame_code`, `bearing`, `status`, `in_stock`, `part_count`)
SELECT `category`, COALESCE(`frame_code`, ''), COALESCE(`bearing`, ''), `status`, `available` > 0, count(*) FROM `parts` GROUP BY 1, 2, 3, 4, 5;
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
