CREATE TABLE `order_changes` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`order_id` integer NOT NULL,
	`user_id` text NOT NULL,
	`kind` text NOT NULL,
	`lines` text NOT NULL,
	`before_total_cents` integer NOT NULL,
	`after_total_cents` integer NOT NULL,
	`adjustment_cents` integer NOT NULL,
	`settlement` text NOT NULL,
	`refund_state` text,
	`refund_id` text,
	`refund_attempts` integer DEFAULT 0 NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "order_changes_kind_ck" CHECK(kind IN ('change', 'cancel')),
	CONSTRAINT "order_changes_settlement_ck" CHECK(settlement IN ('card-refund', 'amended-invoice', 'payment-cancelled')),
	CONSTRAINT "order_changes_refund_state_ck" CHECK(refund_state IN ('pending', 'refunded', 'failed')),
	CONSTRAINT "order_changes_money_ck" CHECK(before_total_cents >= 0 AND after_total_cents >= 0 AND adjustment_cents >= 0 AND refund_attempts >= 0),
	CONSTRAINT "order_changes_refund_ck" CHECK((settlement = 'card-refund') = (refund_state IS NOT NULL))
);
--> statement-breakpoint
CREATE INDEX `order_changes_order_idx` ON `order_changes` (`order_id`);--> statement-breakpoint
CREATE INDEX `order_changes_user_idx` ON `order_changes` (`user_id`);--> statement-breakpoint
CREATE INDEX `order_changes_refund_idx` ON `order_changes` (`refund_state`);--> statement-breakpoint
CREATE TABLE `parts_list_lines` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`list_id` integer NOT NULL,
	`part_id` integer NOT NULL,
	`quantity` integer NOT NULL,
	`added_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`list_id`) REFERENCES `parts_lists`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`added_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null,
	CONSTRAINT "parts_list_lines_quantity_ck" CHECK(quantity > 0)
);
--> statement-breakpoint
CREATE UNIQUE INDEX `parts_list_lines_list_part_uq` ON `parts_list_lines` (`list_id`,`part_id`);--> statement-breakpoint
CREATE INDEX `parts_list_lines_part_idx` ON `parts_list_lines` (`part_id`);--> statement-breakpoint
CREATE INDEX `parts_list_lines_added_by_idx` ON `parts_list_lines` (`added_by`);--> statement-breakpoint
CREATE TABLE `parts_lists` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`dealer_account_id` integer NOT NULL,
	`name` text NOT NULL,
	`created_by` text,
	`updated_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`dealer_account_id`) REFERENCES `dealer_accounts`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`updated_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `parts_lists_dealer_name_uq` ON `parts_lists` (`dealer_account_id`,lower("name"));--> statement-breakpoint
CREATE INDEX `parts_lists_created_by_idx` ON `parts_lists` (`created_by`);--> statement-breakpoint
CREATE INDEX `parts_lists_updated_by_idx` ON `parts_lists` (`updated_by`);--> statement-breakpoint
PRAGMA foreign_keys=OFF;--> statement-breakpoint
CREATE TABLE `__new_mail_outbox` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`kind` text NOT NULL,
	`recipient` text NOT NULL,
	`subject` text NOT NULL,
	`text` text NOT NULL,
	`html` text NOT NULL,
	`state` text DEFAULT 'queued' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`next_attempt_at` integer NOT NULL,
	`claimed_by` text,
	`claim_expires_at` integer,
	`last_error` text,
	`last_attempt_at` text,
	`sent_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	CONSTRAINT "mail_outbox_kind_ck" CHECK(kind IN ('order-confirmation', 'payment-failed', 'back-order', 'short-pick', 'dispatch', 'return-decision', 'dealer-application-received', 'dealer-approved', 'dealer-declined', 'password-reset', 'account-confirm', 'existing-account-notice', 'order-changed')),
	CONSTRAINT "mail_outbox_state_ck" CHECK(state IN ('queued', 'sending', 'sent', 'failed')),
	CONSTRAINT "mail_outbox_attempts_ck" CHECK(attempts >= 0),
	CONSTRAINT "mail_outbox_sent_ck" CHECK(state <> 'sent' OR sent_at IS NOT NULL)
);
--> statement-breakpoint
INSERT INTO `__new_mail_outbox`("id", "kind", "recipient", "subject", "text", "html", "state", "attempts", "next_attempt_at", "claimed_by", "claim_expires_at", "last_error", "last_attempt_at", "sent_at", "created_at") SELECT "id", "kind", "recipient", "subject", "text", "html", "state", "attempts", "next_attempt_at", "claimed_by", "claim_expires_at", "last_error", "last_attempt_at", "sent_at", "created_at" FROM `mail_outbox`;--> statement-breakpoint
DROP TABLE `mail_outbox`;--> statement-breakpoint
ALTER TABLE `__new_mail_outbox` RENAME TO `mail_outbox`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
CREATE INDEX `mail_outbox_due_idx` ON `mail_outbox` (`state`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `mail_outbox_created_idx` ON `mail_outbox` (`created_at`);