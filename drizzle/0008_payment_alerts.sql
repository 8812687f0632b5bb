CREATE TABLE `payment_alerts` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`order_id` integer NOT NULL,
	`payment_intent_id` text NOT NULL,
	`amount_cents` integer NOT NULL,
	`what` text NOT NULL,
	`refund_state` text DEFAULT 'pending' NOT NULL,
	`refund_id` text,
	`last_error` text,
	`attempts` integer DEFAULT 0 NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE cascade,
	CONSTRAINT "payment_alerts_refund_state_ck" CHECK(refund_state IN ('pending', 'refunded', 'failed')),
	CONSTRAINT "payment_alerts_money_ck" CHECK(amount_cents >= 0 AND attempts >= 0)
);
--> statement-breakpoint
CREATE UNIQUE INDEX `payment_alerts_payment_intent_id_unique` ON `payment_alerts` (`payment_intent_id`);--> statement-breakpoint
CREATE INDEX `payment_alerts_order_idx` ON `payment_alerts` (`order_id`);