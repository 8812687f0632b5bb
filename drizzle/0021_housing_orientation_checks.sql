PRAGMA foreign_keys=OFF;--> statement-breakpoint
CREATE TABLE `__new_cart_lines` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`cart_id` integer NOT NULL,
	`part_id` integer NOT NULL,
	`quantity` integer NOT NULL,
	`fitment_id` integer,
	`allow_backorder` integer DEFAULT false NOT NULL,
	`compressor_outlet_clock` text,
	`turbine_inlet_clock` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`cart_id`) REFERENCES `carts`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`fitment_id`) REFERENCES `saved_fitments`(`id`) ON UPDATE no action ON DELETE set null,
	CONSTRAINT "cart_lines_compressor_outlet_clock_ck" CHECK(compressor_outlet_clock IN ('12:00', '1:30', '2:00', '3:00', '4:00', '4:30', '6:00', '7:30', '8:00', '9:00', '10:00', '10:30')),
	CONSTRAINT "cart_lines_turbine_inlet_clock_ck" CHECK(turbine_inlet_clock IN ('12:00', '1:30', '2:00', '3:00', '4:00', '4:30', '6:00', '7:30', '8:00', '9:00', '10:00', '10:30')),
	CONSTRAINT "cart_lines_orientation_ck" CHECK((compressor_outlet_clock IS NULL) = (turbine_inlet_clock IS NULL)),
	CONSTRAINT "cart_lines_quantity_ck" CHECK(quantity > 0)
);
--> statement-breakpoint
INSERT INTO `__new_cart_lines`("id", "cart_id", "part_id", "quantity", "fitment_id", "allow_backorder", "compressor_outlet_clock", "turbine_inlet_clock", "created_at") SELECT "id", "cart_id", "part_id", "quantity", "fitment_id", "allow_backorder", "compressor_outlet_clock", "turbine_inlet_clock", "created_at" FROM `cart_lines`;--> statement-breakpoint
DROP TABLE `cart_lines`;--> statement-breakpoint
ALTER TABLE `__new_cart_lines` RENAME TO `cart_lines`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
CREATE UNIQUE INDEX `cart_lines_cart_part_uq` ON `cart_lines` (`cart_id`,`part_id`);--> statement-breakpoint
CREATE INDEX `cart_lines_part_idx` ON `cart_lines` (`part_id`);--> statement-breakpoint
CREATE INDEX `cart_lines_fitment_idx` ON `cart_lines` (`fitment_id`);--> statement-breakpoint
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
	`compressor_outlet_clock` text,
	`turbine_inlet_clock` text,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "order_lines_compressor_outlet_clock_ck" CHECK(compressor_outlet_clock IN ('12:00', '1:30', '2:00', '3:00', '4:00', '4:30', '6:00', '7:30', '8:00', '9:00', '10:00', '10:30')),
	CONSTRAINT "order_lines_turbine_inlet_clock_ck" CHECK(turbine_inlet_clock IN ('12:00', '1:30', '2:00', '3:00', '4:00', '4:30', '6:00', '7:30', '8:00', '9:00', '10:00', '10:30')),
	CONSTRAINT "order_lines_orientation_ck" CHECK((compressor_outlet_clock IS NULL) = (turbine_inlet_clock IS NULL)),
	CONSTRAINT "order_lines_quantities_ck" CHECK(quantity > 0 AND quantity_backordered BETWEEN 0 AND quantity AND quantity_picked BETWEEN 0 AND quantity AND quantity_dispatched BETWEEN 0 AND quantity),
	CONSTRAINT "order_lines_money_ck" CHECK(unit_price_cents >= 0 AND retail_unit_price_cents >= 0 AND core_deposit_cents >= 0 AND weight_grams >= 0)
);
--> statement-breakpoint
INSERT INTO `__new_order_lines`("id", "order_id", "part_id", "part_number", "title", "quantity", "quantity_backordered", "quantity_picked", "quantity_dispatched", "unit_price_cents", "retail_unit_price_cents", "core_deposit_cents", "weight_grams", "fitment_id", "fitment_summary", "compressor_outlet_clock", "turbine_inlet_clock") SELECT "id", "order_id", "part_id", "part_number", "title", "quantity", "quantity_backordered", "quantity_picked", "quantity_dispatched", "unit_price_cents", "retail_unit_price_cents", "core_deposit_cents", "weight_grams", "fitment_id", "fitment_summary", "compressor_outlet_clock", "turbine_inlet_clock" FROM `order_lines`;--> statement-breakpoint
DROP TABLE `order_lines`;--> statement-breakpoint
ALTER TABLE `__new_order_lines` RENAME TO `order_lines`;--> statement-breakpoint
CREATE INDEX `order_lines_order_idx` ON `order_lines` (`order_id`);--> statement-breakpoint
CREATE INDEX `order_lines_part_idx` ON `order_lines` (`part_id`);