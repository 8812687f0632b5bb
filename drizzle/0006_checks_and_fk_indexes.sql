-- Adds CHECK constraints (allowed values from shared/allowed-values.ts, the stock ledger's invariant, money never
-- negative) and indexes on foreign keys that had none. SQLite adds a constraint by rebuilding the table; the
-- app runs migrations with foreign keys off and checks every reference afterwards (server/db/client.ts).
PRAGMA foreign_keys=OFF;--> statement-breakpoint
CREATE TABLE `__new_cart_lines` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`cart_id` integer NOT NULL,
	`part_id` integer NOT NULL,
	`quantity` integer NOT NULL,
	`fitment_id` integer,
	`allow_backorder` integer DEFAULT false NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`cart_id`) REFERENCES `carts`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`fitment_id`) REFERENCES `saved_fitments`(`id`) ON UPDATE no action ON DELETE set null,
	CONSTRAINT "cart_lines_quantity_ck" CHECK(quantity > 0)
);
--> statement-breakpoint
INSERT INTO `__new_cart_lines`("id", "cart_id", "part_id", "quantity", "fitment_id", "allow_backorder", "created_at") SELECT "id", "cart_id", "part_id", "quantity", "fitment_id", "allow_backorder", "created_at" FROM `cart_lines`;--> statement-breakpoint
DROP TABLE `cart_lines`;--> statement-breakpoint
ALTER TABLE `__new_cart_lines` RENAME TO `cart_lines`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
CREATE UNIQUE INDEX `cart_lines_cart_part_uq` ON `cart_lines` (`cart_id`,`part_id`);--> statement-breakpoint
CREATE INDEX `cart_lines_part_idx` ON `cart_lines` (`part_id`);--> statement-breakpoint
CREATE INDEX `cart_lines_fitment_idx` ON `cart_lines` (`fitment_id`);--> statement-breakpoint
CREATE TABLE `__new_credit_notes` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`number` text NOT NULL,
	`dealer_account_id` integer NOT NULL,
	`order_id` integer NOT NULL,
	`return_id` integer NOT NULL,
	`amount_cents` integer NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`dealer_account_id`) REFERENCES `dealer_accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`return_id`) REFERENCES `returns`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "credit_notes_amount_ck" CHECK(amount_cents >= 0)
);
--> statement-breakpoint
INSERT INTO `__new_credit_notes`("id", "number", "dealer_account_id", "order_id", "return_id", "amount_cents", "created_at") SELECT "id", "number", "dealer_account_id", "order_id", "return_id", "amount_cents", "created_at" FROM `credit_notes`;--> statement-breakpoint
DROP TABLE `credit_notes`;--> statement-breakpoint
ALTER TABLE `__new_credit_notes` RENAME TO `credit_notes`;--> statement-breakpoint
CREATE UNIQUE INDEX `credit_notes_number_unique` ON `credit_notes` (`number`);--> statement-breakpoint
CREATE UNIQUE INDEX `credit_notes_return_id_unique` ON `credit_notes` (`return_id`);--> statement-breakpoint
CREATE INDEX `credit_notes_dealer_idx` ON `credit_notes` (`dealer_account_id`);--> statement-breakpoint
CREATE INDEX `credit_notes_order_idx` ON `credit_notes` (`order_id`);--> statement-breakpoint
CREATE INDEX `dealer_members_dealer_idx` ON `dealer_members` (`dealer_account_id`);--> statement-breakpoint
CREATE TABLE `__new_order_lines` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`order_id` integer NOT NULL,
	`part_id` integer NOT NULL,
	`part_number` text NOT NULL,
	`title` text NOT NULL,
	`quantity` integer NOT NULL,
	`quantity_backordered` integer DEFAULT 0 NOT NULL,
	`quantity_picked` integer DEFAULT 0 NOT NULL,
	`quantity_dispatched` integer DEFAULT 0 NOT NULL,
	`unit_price_cents` integer NOT NULL,
	`retail_unit_price_cents` integer NOT NULL,
	`core_deposit_cents` integer DEFAULT 0 NOT NULL,
	`weight_grams` integer NOT NULL,
	`fitment_id` integer,
	`fitment_summary` text,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "order_lines_quantities_ck" CHECK(quantity > 0 AND quantity_backordered BETWEEN 0 AND quantity AND quantity_picked BETWEEN 0 AND quantity AND quantity_dispatched BETWEEN 0 AND quantity),
	CONSTRAINT "order_lines_money_ck" CHECK(unit_price_cents >= 0 AND retail_unit_price_cents >= 0 AND core_deposit_cents >= 0 AND weight_grams >= 0)
);
--> statement-breakpoint
INSERT INTO `__new_order_lines`("id", "order_id", "part_id", "part_number", "title", "quantity", "quantity_backordered", "quantity_picked", "quantity_dispatched", "unit_price_cents", "retail_unit_price_cents", "core_deposit_cents", "weight_grams", "fitment_id", "fitment_summary") SELECT "id", "order_id", "part_id", "part_number", "title", "quantity", "quantity_backordered", "quantity_picked", "quantity_dispatched", "unit_price_cents", "retail_unit_price_cents", "core_deposit_cents", "weight_grams", "fitment_id", "fitment_summary" FROM `order_lines`;--> statement-breakpoint
DROP TABLE `order_lines`;--> statement-breakpoint
ALTER TABLE `__new_order_lines` RENAME TO `order_lines`;--> statement-breakpoint
CREATE INDEX `order_lines_order_idx` ON `order_lines` (`order_id`);--> statement-breakpoint
CREATE INDEX `order_lines_part_idx` ON `order_lines` (`part_id`);--> statement-breakpoint
CREATE TABLE `__new_price_imports` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` text NOT NULL,
	`file_name` text NOT NULL,
	`status` text DEFAULT 'preview' NOT NULL,
	`rows` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`applied_at` text,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "price_imports_status_ck" CHECK(status IN ('preview', 'applied'))
);
--> statement-breakpoint
INSERT INTO `__new_price_imports`("id", "user_id", "file_name", "status", "rows", "created_at", "applied_at") SELECT "id", "user_id", "file_name", "status", "rows", "created_at", "applied_at" FROM `price_imports`;--> statement-breakpoint
DROP TABLE `price_imports`;--> statement-breakpoint
ALTER TABLE `__new_price_imports` RENAME TO `price_imports`;--> statement-breakpoint
CREATE INDEX `price_imports_user_idx` ON `price_imports` (`user_id`);--> statement-breakpoint
CREATE TABLE `__new_return_photos` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`return_id` integer NOT NULL,
	`stored_name` text NOT NULL,
	`mime_type` text NOT NULL,
	`bytes` integer NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`return_id`) REFERENCES `returns`(`id`) ON UPDATE no action ON DELETE cascade,
	CONSTRAINT "return_photos_bytes_ck" CHECK(bytes >= 0)
);
--> statement-breakpoint
INSERT INTO `__new_return_photos`("id", "return_id", "stored_name", "mime_type", "bytes", "created_at") SELECT "id", "return_id", "stored_name", "mime_type", "bytes", "created_at" FROM `return_photos`;--> statement-breakpoint
DROP TABLE `return_photos`;--> statement-breakpoint
ALTER TABLE `__new_return_photos` RENAME TO `return_photos`;--> statement-breakpoint
CREATE UNIQUE INDEX `return_photos_stored_name_unique` ON `return_photos` (`stored_name`);--> statement-breakpoint
CREATE INDEX `return_photos_return_idx` ON `return_photos` (`return_id`);--> statement-breakpoint
CREATE TABLE `__new_returns` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`reference` text NOT NULL,
	`order_id` integer NOT NULL,
	`order_line_id` integer NOT NULL,
	`user_id` text NOT NULL,
	`kind` text NOT NULL,
	`quantity` integer NOT NULL,
	`reason` text NOT NULL,
	`status` text DEFAULT 'requested' NOT NULL,
	`condition_grade` text,
	`decision` text,
	`refund_cents` integer DEFAULT 0 NOT NULL,
	`reject_reason` text,
	`payment_refund_id` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`decided_at` text,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`order_line_id`) REFERENCES `order_lines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "returns_kind_ck" CHECK(kind IN ('wrong-part', 'faulty', 'core')),
	CONSTRAINT "returns_status_ck" CHECK(status IN ('requested', 'refunded', 'credited', 'rejected')),
	CONSTRAINT "returns_condition_grade_ck" CHECK(condition_grade IN ('as-new', 'rebuildable', 'damaged', 'scrap')),
	CONSTRAINT "returns_amounts_ck" CHECK(quantity > 0 AND refund_cents >= 0)
);
--> statement-breakpoint
INSERT INTO `__new_returns`("id", "reference", "order_id", "order_line_id", "user_id", "kind", "quantity", "reason", "status", "condition_grade", "decision", "refund_cents", "reject_reason", "payment_refund_id", "created_at", "decided_at") SELECT "id", "reference", "order_id", "order_line_id", "user_id", "kind", "quantity", "reason", "status", "condition_grade", "decision", "refund_cents", "reject_reason", "payment_refund_id", "created_at", "decided_at" FROM `returns`;--> statement-breakpoint
DROP TABLE `returns`;--> statement-breakpoint
ALTER TABLE `__new_returns` RENAME TO `returns`;--> statement-breakpoint
CREATE UNIQUE INDEX `returns_reference_unique` ON `returns` (`reference`);--> statement-breakpoint
CREATE INDEX `returns_order_idx` ON `returns` (`order_id`);--> statement-breakpoint
CREATE INDEX `returns_status_idx` ON `returns` (`status`);--> statement-breakpoint
CREATE INDEX `returns_order_line_idx` ON `returns` (`order_line_id`);--> statement-breakpoint
CREATE INDEX `returns_user_idx` ON `returns` (`user_id`);--> statement-breakpoint
CREATE INDEX `shaft_logs_frame_idx` ON `shaft_logs` (`frame_code`);--> statement-breakpoint
CREATE TABLE `__new_stock_movements` (
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
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "stock_movements_kind_ck" CHECK(kind IN ('goods-in', 'reserve', 'release', 'pick', 'dispatch', 'adjustment', 'return'))
);
--> statement-breakpoint
INSERT INTO `__new_stock_movements`("id", "part_id", "bin_code", "kind", "on_hand_delta", "reserved_delta", "order_id", "note", "created_at") SELECT "id", "part_id", "bin_code", "kind", "on_hand_delta", "reserved_delta", "order_id", "note", "created_at" FROM `stock_movements`;--> statement-breakpoint
DROP TABLE `stock_movements`;--> statement-breakpoint
ALTER TABLE `__new_stock_movements` RENAME TO `stock_movements`;--> statement-breakpoint
CREATE INDEX `stock_movements_part_idx` ON `stock_movements` (`part_id`,`bin_code`);--> statement-breakpoint
CREATE INDEX `stock_movements_order_idx` ON `stock_movements` (`order_id`);--> statement-breakpoint
CREATE INDEX `stock_movements_bin_idx` ON `stock_movements` (`bin_code`);--> statement-breakpoint
CREATE TABLE `__new_carts` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` text,
	`guest_token` text,
	`delivery_zone` text DEFAULT 'national' NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade,
	CONSTRAINT "carts_delivery_zone_ck" CHECK(delivery_zone IN ('local', 'national', 'remote'))
);
--> statement-breakpoint
INSERT INTO `__new_carts`("id", "user_id", "guest_token", "delivery_zone", "updated_at") SELECT "id", "user_id", "guest_token", "delivery_zone", "updated_at" FROM `carts`;--> statement-breakpoint
DROP TABLE `carts`;--> statement-breakpoint
ALTER TABLE `__new_carts` RENAME TO `carts`;--> statement-breakpoint
CREATE UNIQUE INDEX `carts_user_id_unique` ON `carts` (`user_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `carts_guest_token_unique` ON `carts` (`guest_token`);--> statement-breakpoint
CREATE TABLE `__new_dealer_accounts` (
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
	`decided_at` text,
	CONSTRAINT "dealer_accounts_status_ck" CHECK(status IN ('pending', 'approved', 'declined')),
	CONSTRAINT "dealer_accounts_tier_ck" CHECK(tier IN ('standard', 'preferred', 'partner')),
	CONSTRAINT "dealer_accounts_delivery_zone_ck" CHECK(delivery_zone IN ('local', 'national', 'remote')),
	CONSTRAINT "dealer_accounts_terms_ck" CHECK(credit_limit_cents >= 0 AND payment_terms_days > 0)
);
--> statement-breakpoint
INSERT INTO `__new_dealer_accounts`("id", "company_name", "contact_name", "phone", "tax_number", "address_line1", "city", "postcode", "delivery_zone", "status", "tier", "credit_limit_cents", "payment_terms_days", "decline_reason", "created_at", "decided_at") SELECT "id", "company_name", "contact_name", "phone", "tax_number", "address_line1", "city", "postcode", "delivery_zone", "status", "tier", "credit_limit_cents", "payment_terms_days", "decline_reason", "created_at", "decided_at" FROM `dealer_accounts`;--> statement-breakpoint
DROP TABLE `dealer_accounts`;--> statement-breakpoint
ALTER TABLE `__new_dealer_accounts` RENAME TO `dealer_accounts`;--> statement-breakpoint
CREATE TABLE `__new_orders` (
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
	FOREIGN KEY (`dealer_account_id`) REFERENCES `dealer_accounts`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "orders_status_ck" CHECK(status IN ('pending_payment', 'paid', 'on_account', 'picking', 'packed', 'dispatched', 'back_ordered', 'cancelled', 'returned')),
	CONSTRAINT "orders_payment_method_ck" CHECK(payment_method IN ('card', 'account')),
	CONSTRAINT "orders_payment_state_ck" CHECK(payment_state IN ('awaiting', 'requires_action', 'failed', 'paid', 'on_account', 'refunded', 'partially_refunded')),
	CONSTRAINT "orders_delivery_zone_ck" CHECK(delivery_zone IN ('local', 'national', 'remote')),
	CONSTRAINT "orders_money_ck" CHECK(goods_cents >= 0 AND discount_cents >= 0 AND core_deposit_cents >= 0 AND freight_cents >= 0 AND tax_cents >= 0 AND total_cents >= 0 AND refunded_cents >= 0 AND refunded_cents <= total_cents),
	CONSTRAINT "orders_weight_ck" CHECK(weight_grams >= 0)
);
--> statement-breakpoint
INSERT INTO `__new_orders`("id", "number", "user_id", "dealer_account_id", "status", "payment_method", "payment_state", "payment_intent_id", "purchase_order", "payment_terms_days", "currency", "goods_cents", "discount_cents", "core_deposit_cents", "freight_cents", "tax_cents", "total_cents", "refunded_cents", "weight_grams", "delivery_zone", "ship_name", "ship_line1", "ship_city", "ship_postcode", "email", "carrier", "tracking_number", "cartons", "packed_weight_grams", "created_at", "updated_at") SELECT "id", "number", "user_id", "dealer_account_id", "status", "payment_method", "payment_state", "payment_intent_id", "purchase_order", "payment_terms_days", "currency", "goods_cents", "discount_cents", "core_deposit_cents", "freight_cents", "tax_cents", "total_cents", "refunded_cents", "weight_grams", "delivery_zone", "ship_name", "ship_line1", "ship_city", "ship_postcode", "email", "carrier", "tracking_number", "cartons", "packed_weight_grams", "created_at", "updated_at" FROM `orders`;--> statement-breakpoint
DROP TABLE `orders`;--> statement-breakpoint
ALTER TABLE `__new_orders` RENAME TO `orders`;--> statement-breakpoint
CREATE UNIQUE INDEX `orders_number_unique` ON `orders` (`number`);--> statement-breakpoint
CREATE UNIQUE INDEX `orders_payment_intent_id_unique` ON `orders` (`payment_intent_id`);--> statement-breakpoint
CREATE INDEX `orders_user_idx` ON `orders` (`user_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `orders_status_idx` ON `orders` (`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `orders_dealer_idx` ON `orders` (`dealer_account_id`);--> statement-breakpoint
CREATE TABLE `__new_part_aliases` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`part_id` integer NOT NULL,
	`alias` text NOT NULL,
	`normalized_alias` text NOT NULL,
	`kind` text NOT NULL,
	`source` text,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE cascade,
	CONSTRAINT "part_aliases_kind_ck" CHECK(kind IN ('cross-reference', 'superseded'))
);
--> statement-breakpoint
INSERT INTO `__new_part_aliases`("id", "part_id", "alias", "normalized_alias", "kind", "source") SELECT "id", "part_id", "alias", "normalized_alias", "kind", "source" FROM `part_aliases`;--> statement-breakpoint
DROP TABLE `part_aliases`;--> statement-breakpoint
ALTER TABLE `__new_part_aliases` RENAME TO `part_aliases`;--> statement-breakpoint
CREATE INDEX `part_aliases_normalized_idx` ON `part_aliases` (`normalized_alias`);--> statement-breakpoint
CREATE INDEX `part_aliases_part_idx` ON `part_aliases` (`part_id`);--> statement-breakpoint
CREATE TABLE `__new_part_specs` (
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
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE cascade,
	CONSTRAINT "part_specs_bearing_ck" CHECK(bearing IN ('journal', 'ball'))
);
--> statement-breakpoint
INSERT INTO `__new_part_specs`("part_id", "compressor_ar", "turbine_ar", "trim_pct", "inducer_mm", "exducer_mm", "flange_pattern", "inlet_mm", "outlet_mm", "material", "bearing", "wastegate", "cooling", "gauge_type", "range_text", "mounting", "connection") SELECT "part_id", "compressor_ar", "turbine_ar", "trim_pct", "inducer_mm", "exducer_mm", "flange_pattern", "inlet_mm", "outlet_mm", "material", "bearing", "wastegate", "cooling", "gauge_type", "range_text", "mounting", "connection" FROM `part_specs`;--> statement-breakpoint
DROP TABLE `part_specs`;--> statement-breakpoint
ALTER TABLE `__new_part_specs` RENAME TO `part_specs`;--> statement-breakpoint
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
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`frame_code`) REFERENCES `frames`(`code`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "parts_status_ck" CHECK(status IN ('active', 'superseded', 'discontinued')),
	CONSTRAINT "parts_condition_ck" CHECK(condition IN ('new', 'exchange')),
	CONSTRAINT "parts_category_ck" CHECK(category IN ('turbochargers', 'cartridges', 'compressor-housings', 'turbine-housings', 'gaskets-fittings', 'gauges-sensors')),
	CONSTRAINT "parts_money_ck" CHECK(price_cents >= 0 AND core_deposit_cents >= 0),
	CONSTRAINT "parts_counts_ck" CHECK(weight_grams >= 0 AND min_stock >= 0 AND available >= 0)
);
--> statement-breakpoint
INSERT INTO `__new_parts`("id", "part_number", "normalized_number", "title", "category", "frame_code", "status", "condition", "price_cents", "core_deposit_cents", "weight_grams", "description", "superseded_by", "images", "min_stock", "available", "created_at", "updated_at") SELECT "id", "part_number", "normalized_number", "title", "category", "frame_code", "status", "condition", "price_cents", "core_deposit_cents", "weight_grams", "description", "superseded_by", "images", "min_stock", "available", "created_at", "updated_at" FROM `parts`;--> statement-breakpoint
DROP TABLE `parts`;--> statement-breakpoint
ALTER TABLE `__new_parts` RENAME TO `parts`;--> statement-breakpoint
CREATE UNIQUE INDEX `parts_part_number_uq` ON `parts` (`part_number`);--> statement-breakpoint
CREATE INDEX `parts_normalized_number_idx` ON `parts` (`normalized_number`);--> statement-breakpoint
CREATE INDEX `parts_frame_idx` ON `parts` (`frame_code`,`status`,`available`);--> statement-breakpoint
CREATE INDEX `parts_listing_idx` ON `parts` (`category`,`frame_code`,`status`,`available`);--> statement-breakpoint
CREATE INDEX `parts_browse_order_idx` ON `parts` ((CASE category WHEN 'turbochargers' THEN 0 WHEN 'cartridges' THEN 1 WHEN 'compressor-housings' THEN 2 WHEN 'turbine-housings' THEN 3 WHEN 'gaskets-fittings' THEN 4 WHEN 'gauges-sensors' THEN 5 ELSE 6 END),`frame_code`,`part_number`);--> statement-breakpoint
CREATE TABLE `__new_shipments` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`order_id` integer NOT NULL,
	`carrier` text NOT NULL,
	`tracking_number` text NOT NULL,
	`cartons` integer NOT NULL,
	`weight_grams` integer NOT NULL,
	`units` integer NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "shipments_counts_ck" CHECK(cartons > 0 AND weight_grams >= 0 AND units > 0)
);
--> statement-breakpoint
INSERT INTO `__new_shipments`("id", "order_id", "carrier", "tracking_number", "cartons", "weight_grams", "units", "created_at") SELECT "id", "order_id", "carrier", "tracking_number", "cartons", "weight_grams", "units", "created_at" FROM `shipments`;--> statement-breakpoint
DROP TABLE `shipments`;--> statement-breakpoint
ALTER TABLE `__new_shipments` RENAME TO `shipments`;--> statement-breakpoint
CREATE INDEX `shipments_order_idx` ON `shipments` (`order_id`);--> statement-breakpoint
CREATE TABLE `__new_stock` (
	`part_id` integer NOT NULL,
	`bin_code` text NOT NULL,
	`on_hand` integer DEFAULT 0 NOT NULL,
	`reserved` integer DEFAULT 0 NOT NULL,
	PRIMARY KEY(`part_id`, `bin_code`),
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`bin_code`) REFERENCES `bins`(`code`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "stock_levels_ck" CHECK(on_hand >= 0 AND reserved >= 0 AND reserved <= on_hand)
);
--> statement-breakpoint
INSERT INTO `__new_stock`("part_id", "bin_code", "on_hand", "reserved") SELECT "part_id", "bin_code", "on_hand", "reserved" FROM `stock`;--> statement-breakpoint
DROP TABLE `stock`;--> statement-breakpoint
ALTER TABLE `__new_stock` RENAME TO `stock`;--> statement-breakpoint
CREATE INDEX `stock_bin_idx` ON `stock` (`bin_code`);--> statement-breakpoint
CREATE TABLE `__new_user` (
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
	`ban_expires` integer,
	CONSTRAINT "user_role_ck" CHECK(role IN ('customer', 'dealer', 'warehouse', 'admin'))
);
--> statement-breakpoint
INSERT INTO `__new_user`("id", "name", "email", "email_verified", "image", "created_at", "updated_at", "role", "banned", "ban_reason", "ban_expires") SELECT "id", "name", "email", "email_verified", "image", "created_at", "updated_at", "role", "banned", "ban_reason", "ban_expires" FROM `user`;--> statement-breakpoint
DROP TABLE `user`;--> statement-breakpoint
ALTER TABLE `__new_user` RENAME TO `user`;--> statement-breakpoint
CREATE UNIQUE INDEX `user_email_unique` ON `user` (`email`);