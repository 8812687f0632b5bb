CREATE TABLE `audit_log` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` text,
	`action` text NOT NULL,
	`part_id` integer,
	`part_number` text,
	`price_import_id` integer,
	`changes` text DEFAULT '{}' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`price_import_id`) REFERENCES `price_imports`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "audit_log_action_ck" CHECK(action IN ('part-created', 'part-edited', 'part-superseded', 'part-links-set', 'part-photos-added', 'price-imported', 'part-imported'))
);
--> statement-breakpoint
CREATE INDEX `audit_log_part_idx` ON `audit_log` (`part_number`,`id`);--> statement-breakpoint
CREATE INDEX `audit_log_user_idx` ON `audit_log` (`user_id`,`id`);--> statement-breakpoint
CREATE INDEX `audit_log_created_idx` ON `audit_log` (`created_at`);--> statement-breakpoint
CREATE INDEX `audit_log_import_idx` ON `audit_log` (`price_import_id`);--> statement-breakpoint
CREATE TABLE `dealer_payments` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`dealer_account_id` integer NOT NULL,
	`order_id` integer NOT NULL,
	`amount_cents` integer NOT NULL,
	`reference` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`dealer_account_id`) REFERENCES `dealer_accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "dealer_payments_amount_ck" CHECK(amount_cents >= 0)
);
--> statement-breakpoint
CREATE INDEX `dealer_payments_dealer_idx` ON `dealer_payments` (`dealer_account_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `dealer_payments_order_idx` ON `dealer_payments` (`order_id`);--> statement-breakpoint
ALTER TABLE `price_imports` ADD `max_change_pct` integer DEFAULT 30 NOT NULL;--> statement-breakpoint
ALTER TABLE `price_imports` ADD `applied_by` text REFERENCES user(id);--> statement-breakpoint
ALTER TABLE `price_imports` ADD `changed_count` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `price_imports` ADD `new_count` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `price_imports` ADD `flagged_count` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
CREATE INDEX `price_imports_created_idx` ON `price_imports` (`created_at`);