CREATE TABLE `bins` (
	`code` text PRIMARY KEY NOT NULL,
	`zone` text NOT NULL,
	`walk_order` integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE `frames` (
	`code` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`inducer_mm` real NOT NULL,
	`exducer_mm` real NOT NULL,
	`turbine_wheel_mm` real NOT NULL,
	`power_min_hp` integer NOT NULL,
	`power_max_hp` integer NOT NULL,
	`max_flow_lb_min` real NOT NULL,
	`flow_ref_temp_k` real DEFAULT 288.15 NOT NULL,
	`flow_ref_pressure_kpa` real DEFAULT 101.325 NOT NULL,
	`max_pressure_ratio` real NOT NULL,
	`max_shaft_rpm` integer NOT NULL,
	`weight_kg` real NOT NULL,
	`flange_pattern` text NOT NULL,
	`bearing_options` text NOT NULL,
	`compressor_map` text NOT NULL
);
--> statement-breakpoint
CREATE TABLE `meta` (
	`key` text PRIMARY KEY NOT NULL,
	`value` text NOT NULL
);
--> statement-breakpoint
CREATE TABLE `part_aliases` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`part_id` integer NOT NULL,
	`alias` text NOT NULL,
	`normalized_alias` text NOT NULL,
	`kind` text NOT NULL,
	`source` text,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `part_aliases_normalized_idx` ON `part_aliases` (`normalized_alias`);--> statement-breakpoint
CREATE INDEX `part_aliases_part_idx` ON `part_aliases` (`part_id`);--> statement-breakpoint
CREATE TABLE `part_links` (
	`part_id` integer NOT NULL,
	`related_part_id` integer NOT NULL,
	`kind` text NOT NULL,
	PRIMARY KEY(`part_id`, `related_part_id`),
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`related_part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `part_links_related_idx` ON `part_links` (`related_part_id`);--> statement-breakpoint
CREATE TABLE `part_specs` (
	`part_id` integer PRIMARY KEY NOT NULL,
	`compressor_ar` real,
	`turbine_ar` real,
	`trim_pct` real,
	`inducer_mm` real,
	`exducer_mm` real,
	`flange_pattern` text,
	`inlet_mm` real,
	`outlet_mm` real,
	`material` text,
	`bearing` text,
	`wastegate` text,
	`cooling` text,
	`gauge_type` text,
	`range_text` text,
	`mounting` text,
	`connection` text,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `parts` (
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
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`frame_code`) REFERENCES `frames`(`code`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `parts_part_number_uq` ON `parts` (`part_number`);--> statement-breakpoint
CREATE INDEX `parts_normalized_number_idx` ON `parts` (`normalized_number`);--> statement-breakpoint
CREATE INDEX `parts_category_idx` ON `parts` (`category`,`frame_code`);--> statement-breakpoint
CREATE INDEX `parts_frame_idx` ON `parts` (`frame_code`);--> statement-breakpoint
CREATE TABLE `stock` (
	`part_id` integer NOT NULL,
	`bin_code` text NOT NULL,
	`on_hand` integer DEFAULT 0 NOT NULL,
	`reserved` integer DEFAULT 0 NOT NULL,
	PRIMARY KEY(`part_id`, `bin_code`),
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`bin_code`) REFERENCES `bins`(`code`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `stock_bin_idx` ON `stock` (`bin_code`);