CREATE TABLE `unit_events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`unit_id` integer NOT NULL,
	`kind` text NOT NULL,
	`summary` text NOT NULL,
	`ref` text,
	`actor_user_id` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`unit_id`) REFERENCES `units`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null,
	CONSTRAINT "unit_events_kind_ck" CHECK(kind IN ('sold', 'registered', 'booked-in', 'received', 'inspected', 'quoted', 'approved', 'declined', 'rebuilt', 'tested', 'shipped', 'log-uploaded', 'reminder-sent', 'note'))
);
--> statement-breakpoint
CREATE INDEX `unit_events_unit_idx` ON `unit_events` (`unit_id`,`id`);--> statement-breakpoint
CREATE INDEX `unit_events_actor_idx` ON `unit_events` (`actor_user_id`);--> statement-breakpoint
CREATE TABLE `units` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`serial` text NOT NULL,
	`part_id` integer,
	`frame_code` text,
	`bearing` text NOT NULL,
	`application` text DEFAULT 'street' NOT NULL,
	`origin` text NOT NULL,
	`owner_user_id` text,
	`dealer_account_id` integer,
	`order_line_id` integer,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`frame_code`) REFERENCES `frames`(`code`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`owner_user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`dealer_account_id`) REFERENCES `dealer_accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`order_line_id`) REFERENCES `order_lines`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "units_bearing_ck" CHECK(bearing IN ('journal', 'ball')),
	CONSTRAINT "units_application_ck" CHECK(application IN ('street', 'circuit', 'drag', 'offroad', 'marine')),
	CONSTRAINT "units_origin_ck" CHECK(origin IN ('sold', 'booked-in'))
);
--> statement-breakpoint
CREATE UNIQUE INDEX `units_serial_uq` ON `units` (`serial`);--> statement-breakpoint
CREATE INDEX `units_owner_idx` ON `units` (`owner_user_id`);--> statement-breakpoint
CREATE INDEX `units_dealer_idx` ON `units` (`dealer_account_id`);--> statement-breakpoint
CREATE INDEX `units_part_idx` ON `units` (`part_id`);--> statement-breakpoint
CREATE INDEX `units_frame_idx` ON `units` (`frame_code`);--> statement-breakpoint
CREATE INDEX `units_order_line_idx` ON `units` (`order_line_id`);--> statement-breakpoint
PRAGMA foreign_keys=OFF;--> statement-breakpoint
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
	CONSTRAINT "user_role_ck" CHECK(role IN ('customer', 'dealer', 'warehouse', 'workshop', 'admin'))
);
--> statement-breakpoint
INSERT INTO `__new_user`("id", "name", "email", "email_verified", "image", "created_at", "updated_at", "role", "banned", "ban_reason", "ban_expires") SELECT "id", "name", "email", "email_verified", "image", "created_at", "updated_at", "role", "banned", "ban_reason", "ban_expires" FROM `user`;--> statement-breakpoint
DROP TABLE `user`;--> statement-breakpoint
ALTER TABLE `__new_user` RENAME TO `user`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
CREATE UNIQUE INDEX `user_email_unique` ON `user` (`email`);--> statement-breakpoint
CREATE TRIGGER IF NOT EXISTS `user_changed_update` AFTER UPDATE ON `user` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'accounts'; END;
--> statement-breakpoint
CREATE TRIGGER IF NOT EXISTS `user_changed_delete` AFTER DELETE ON `user` BEGIN UPDATE `change_versions` SET `version` = `version` + 1 WHERE `topic` = 'accounts'; END;
