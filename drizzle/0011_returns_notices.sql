CREATE TABLE `notices` (
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
	CONSTRAINT "notices_kind_ck" CHECK(kind IN ('paid', 'on-account', 'picking', 'back-ordered', 'dispatched', 'return-decided'))
);
--> statement-breakpoint
CREATE INDEX `notices_user_idx` ON `notices` (`user_id`,`id`);--> statement-breakpoint
CREATE INDEX `notices_unread_idx` ON `notices` (`user_id`,`read_at`);--> statement-breakpoint
CREATE INDEX `notices_order_idx` ON `notices` (`order_id`);--> statement-breakpoint
ALTER TABLE `returns` ADD `decision_reason` text;