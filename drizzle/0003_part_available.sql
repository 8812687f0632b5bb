DROP INDEX `parts_category_idx`;--> statement-breakpoint
DROP INDEX `parts_frame_idx`;--> statement-breakpoint
ALTER TABLE `parts` ADD `available` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
CREATE INDEX `parts_listing_idx` ON `parts` (`category`,`frame_code`,`status`,`available`);--> statement-breakpoint
CREATE INDEX `parts_browse_order_idx` ON `parts` ((CASE category WHEN 'turbochargers' THEN 0 WHEN 'cartridges' THEN 1 WHEN 'compressor-housings' THEN 2 WHEN 'turbine-housings' THEN 3 WHEN 'gaskets-fittings' THEN 4 WHEN 'gauges-sensors' THEN 5 ELSE 6 END),`frame_code`,`part_number`);--> statement-breakpoint
CREATE INDEX `parts_frame_idx` ON `parts` (`frame_code`,`status`,`available`);