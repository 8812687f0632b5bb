CREATE TABLE `account` (
	`id` text PRIMARY KEY NOT NULL,
	`account_id` text NOT NULL,
	`provider_id` text NOT NULL,
	`user_id` text NOT NULL,
	`access_token` text,
	`refresh_token` text,
	`id_token` text,
	`access_token_expires_at` integer,
	`refresh_token_expires_at` integer,
	`scope` text,
	`password` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `account_user_idx` ON `account` (`user_id`);--> statement-breakpoint
CREATE TABLE `bins` (
	`code` text PRIMARY KEY NOT NULL,
	`zone` text NOT NULL,
	`walk_order` integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE `cart_lines` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`cart_id` integer NOT NULL,
	`part_id` integer NOT NULL,
	`quantity` integer NOT NULL,
	`fitment_id` integer,
	`allow_backorder` integer DEFAULT false NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`cart_id`) REFERENCES `carts`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`fitment_id`) REFERENCES `saved_fitments`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `cart_lines_cart_part_uq` ON `cart_lines` (`cart_id`,`part_id`);--> statement-breakpoint
CREATE TABLE `carts` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` text,
	`guest_token` text,
	`delivery_zone` text DEFAULT 'national' NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `carts_user_id_unique` ON `carts` (`user_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `carts_guest_token_unique` ON `carts` (`guest_token`);--> statement-breakpoint
CREATE TABLE `dealer_accounts` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`company_name` text NOT NULL,
	`contact_name` text NOT NULL,
	`phone` text NOT NULL,
	`tax_number` text,
	`address_line1` text NOT NULL,
	`city` text NOT NULL,
	`postcode` text NOT NULL,
	`delivery_zone` text DEFAULT 'national' NOT NULL,
	`status` text DEFAULT 'pending' NOT NULL,
	`tier` text,
	`credit_limit_cents` integer DEFAULT 0 NOT NULL,
	`payment_terms_days` integer DEFAULT 30 NOT NULL,
	`decline_reason` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`decided_at` text
);
--> statement-breakpoint
CREATE TABLE `dealer_members` (
	`user_id` text PRIMARY KEY NOT NULL,
	`dealer_account_id` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`dealer_account_id`) REFERENCES `dealer_accounts`(`id`) ON UPDATE no action ON DELETE no action
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
CREATE TABLE `order_events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`order_id` integer NOT NULL,
	`status` text NOT NULL,
	`note` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `order_events_order_idx` ON `order_events` (`order_id`);--> statement-breakpoint
CREATE TABLE `order_lines` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`order_id` integer NOT NULL,
	`part_id` integer NOT NULL,
	`part_number` text NOT NULL,
	`title` text NOT NULL,
	`quantity` integer NOT NULL,
	`quantity_backordered` integer DEFAULT 0 NOT NULL,
	`quantity_picked` integer DEFAULT 0 NOT NULL,
	`unit_price_cents` integer NOT NULL,
	`retail_unit_price_cents` integer NOT NULL,
	`core_deposit_cents` integer DEFAULT 0 NOT NULL,
	`weight_grams` integer NOT NULL,
	`fitment_id` integer,
	`fitment_summary` text,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `order_lines_order_idx` ON `order_lines` (`order_id`);--> statement-breakpoint
CREATE TABLE `orders` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`number` text NOT NULL,
	`user_id` text NOT NULL,
	`dealer_account_id` integer,
	`status` text NOT NULL,
	`payment_method` text NOT NULL,
	`payment_state` text NOT NULL,
	`payment_intent_id` text,
	`purchase_order` text,
	`payment_terms_days` integer,
	`currency` text DEFAULT 'usd' NOT NULL,
	`goods_cents` integer NOT NULL,
	`discount_cents` integer DEFAULT 0 NOT NULL,
	`core_deposit_cents` integer DEFAULT 0 NOT NULL,
	`freight_cents` integer NOT NULL,
	`tax_cents` integer NOT NULL,
	`total_cents` integer NOT NULL,
	`refunded_cents` integer DEFAULT 0 NOT NULL,
	`weight_grams` integer NOT NULL,
	`delivery_zone` text NOT NULL,
	`ship_name` text NOT NULL,
	`ship_line1` text NOT NULL,
	`ship_city` text NOT NULL,
	`ship_postcode` text NOT NULL,
	`email` text NOT NULL,
	`carrier` text,
	`tracking_number` text,
	`cartons` integer,
	`packed_weight_grams` integer,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`dealer_account_id`) REFERENCES `dealer_accounts`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `orders_number_unique` ON `orders` (`number`);--> statement-breakpoint
CREATE UNIQUE INDEX `orders_payment_intent_id_unique` ON `orders` (`payment_intent_id`);--> statement-breakpoint
CREATE INDEX `orders_user_idx` ON `orders` (`user_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `orders_status_idx` ON `orders` (`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `orders_dealer_idx` ON `orders` (`dealer_account_id`);--> statement-breakpoint
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
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`frame_code`) REFERENCES `frames`(`code`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `parts_part_number_uq` ON `parts` (`part_number`);--> statement-breakpoint
CREATE INDEX `parts_normalized_number_idx` ON `parts` (`normalized_number`);--> statement-breakpoint
CREATE INDEX `parts_category_idx` ON `parts` (`category`,`frame_code`);--> statement-breakpoint
CREATE INDEX `parts_frame_idx` ON `parts` (`frame_code`);--> statement-breakpoint
CREATE TABLE `payment_events` (
	`event_id` text PRIMARY KEY NOT NULL,
	`type` text NOT NULL,
	`payment_intent_id` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `saved_fitments` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` text NOT NULL,
	`name` text NOT NULL,
	`input` text NOT NULL,
	`summary` text NOT NULL,
	`best_frame_code` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `saved_fitments_user_idx` ON `saved_fitments` (`user_id`);--> statement-breakpoint
CREATE TABLE `session` (
	`id` text PRIMARY KEY NOT NULL,
	`expires_at` integer NOT NULL,
	`token` text NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	`ip_address` text,
	`user_agent` text,
	`user_id` text NOT NULL,
	`impersonated_by` text,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `session_token_unique` ON `session` (`token`);--> statement-breakpoint
CREATE INDEX `session_user_idx` ON `session` (`user_id`);--> statement-breakpoint
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
CREATE INDEX `stock_bin_idx` ON `stock` (`bin_code`);--> statement-breakpoint
CREATE TABLE `stock_movements` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`part_id` integer NOT NULL,
	`bin_code` text NOT NULL,
	`kind` text NOT NULL,
	`on_hand_delta` integer DEFAULT 0 NOT NULL,
	`reserved_delta` integer DEFAULT 0 NOT NULL,
	`order_id` integer,
	`note` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`bin_code`) REFERENCES `bins`(`code`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `stock_movements_part_idx` ON `stock_movements` (`part_id`,`bin_code`);--> statement-breakpoint
CREATE INDEX `stock_movements_order_idx` ON `stock_movements` (`order_id`);--> statement-breakpoint
CREATE TABLE `user` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`email` text NOT NULL,
	`email_verified` integer DEFAULT false NOT NULL,
	`image` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	`role` text DEFAULT 'customer',
	`banned` integer DEFAULT false,
	`ban_reason` text,
	`ban_expires` integer
);
--> statement-breakpoint
CREATE UNIQUE INDEX `user_email_unique` ON `user` (`email`);--> statement-breakpoint
CREATE TABLE `verification` (
	`id` text PRIMARY KEY NOT NULL,
	`identifier` text NOT NULL,
	`value` text NOT NULL,
	`expires_at` integer NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL
);
