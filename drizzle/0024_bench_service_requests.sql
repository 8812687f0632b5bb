CREATE TABLE `service_request_events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`request_id` integer NOT NULL,
	`status` text NOT NULL,
	`note` text,
	`actor_user_id` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`request_id`) REFERENCES `service_requests`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `service_request_events_request_idx` ON `service_request_events` (`request_id`,`id`);--> statement-breakpoint
CREATE INDEX `service_request_events_actor_idx` ON `service_request_events` (`actor_user_id`);--> statement-breakpoint
CREATE TABLE `service_request_lines` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`request_id` integer NOT NULL,
	`part_id` integer NOT NULL,
	`part_number` text NOT NULL,
	`title` text NOT NULL,
	`quantity` integer NOT NULL,
	`retail_unit_cents` integer NOT NULL,
	`unit_cents` integer NOT NULL,
	FOREIGN KEY (`request_id`) REFERENCES `service_requests`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`part_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "service_request_lines_amounts_ck" CHECK(quantity > 0 AND retail_unit_cents >= 0 AND unit_cents >= 0)
);
--> statement-breakpoint
CREATE INDEX `service_request_lines_request_idx` ON `service_request_lines` (`request_id`);--> statement-breakpoint
CREATE INDEX `service_request_lines_part_idx` ON `service_request_lines` (`part_id`);--> statement-breakpoint
CREATE TABLE `service_request_photos` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`request_id` integer NOT NULL,
	`stage` text NOT NULL,
	`stored_name` text NOT NULL,
	`mime_type` text NOT NULL,
	`bytes` integer NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`request_id`) REFERENCES `service_requests`(`id`) ON UPDATE no action ON DELETE cascade,
	CONSTRAINT "service_request_photos_stage_ck" CHECK(stage IN ('booking', 'inspection')),
	CONSTRAINT "service_request_photos_bytes_ck" CHECK(bytes >= 0)
);
--> statement-breakpoint
CREATE UNIQUE INDEX `service_request_photos_stored_name_unique` ON `service_request_photos` (`stored_name`);--> statement-breakpoint
CREATE INDEX `service_request_photos_request_idx` ON `service_request_photos` (`request_id`);--> statement-breakpoint
CREATE TABLE `service_requests` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`reference` text NOT NULL,
	`unit_id` integer NOT NULL,
	`user_id` text NOT NULL,
	`dealer_account_id` integer,
	`status` text DEFAULT 'booked' NOT NULL,
	`frame_code` text NOT NULL,
	`bearing` text NOT NULL,
	`application` text NOT NULL,
	`symptoms` text NOT NULL,
	`symptom_notes` text DEFAULT '' NOT NULL,
	`return_name` text NOT NULL,
	`return_line1` text NOT NULL,
	`return_city` text NOT NULL,
	`return_postcode` text NOT NULL,
	`received_at` text,
	`received_by` text,
	`inspection` text,
	`inspected_at` text,
	`inspected_by` text,
	`labour_tenths` integer,
	`labour_rate_cents` integer,
	`labour_cents` integer,
	`balancing_cents` integer,
	`parts_cents` integer,
	`discount_cents` integer,
	`tax_cents` integer,
	`total_cents` integer,
	`quote_notes` text,
	`quoted_at` text,
	`quoted_by` text,
	`inspection_fee_cents` integer NOT NULL,
	`decided_at` text,
	`decision` text,
	`payment_method` text,
	`payment_state` text DEFAULT 'none' NOT NULL,
	`payment_intent_id` text,
	`purchase_order` text,
	`payment_terms_days` integer,
	`charge_cents` integer DEFAULT 0 NOT NULL,
	`rebuild` text,
	`rebuilt_at` text,
	`rebuilt_by` text,
	`carrier` text,
	`tracking_number` text,
	`shipped_at` text,
	`shipped_by` text,
	`invoice_number` text,
	`invoice_paid_at` text,
	`invoice_payment_reference` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`unit_id`) REFERENCES `units`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`dealer_account_id`) REFERENCES `dealer_accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`frame_code`) REFERENCES `frames`(`code`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`received_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`inspected_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`quoted_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`rebuilt_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`shipped_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "service_requests_status_ck" CHECK(status IN ('booked', 'received', 'inspected', 'quoted', 'approved', 'declined', 'rebuilt', 'shipped')),
	CONSTRAINT "service_requests_bearing_ck" CHECK(bearing IN ('journal', 'ball')),
	CONSTRAINT "service_requests_application_ck" CHECK(application IN ('street', 'circuit', 'drag', 'offroad', 'marine')),
	CONSTRAINT "service_requests_payment_method_ck" CHECK(payment_method IN ('card', 'account')),
	CONSTRAINT "service_requests_decision_ck" CHECK(decision IN ('approve', 'decline')),
	CONSTRAINT "service_requests_payment_state_ck" CHECK(payment_state IN ('none', 'paid', 'on_account')),
	CONSTRAINT "service_requests_money_ck" CHECK(inspection_fee_cents >= 0 AND charge_cents >= 0 AND coalesce(total_cents, 0) >= 0 AND coalesce(tax_cents, 0) >= 0 AND coalesce(labour_tenths, 0) >= 0)
);
--> statement-breakpoint
CREATE UNIQUE INDEX `service_requests_reference_unique` ON `service_requests` (`reference`);--> statement-breakpoint
CREATE UNIQUE INDEX `service_requests_payment_intent_id_unique` ON `service_requests` (`payment_intent_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `service_requests_invoice_number_unique` ON `service_requests` (`invoice_number`);--> statement-breakpoint
CREATE INDEX `service_requests_user_idx` ON `service_requests` (`user_id`,`id`);--> statement-breakpoint
CREATE INDEX `service_requests_dealer_idx` ON `service_requests` (`dealer_account_id`);--> statement-breakpoint
CREATE INDEX `service_requests_status_idx` ON `service_requests` (`status`,`id`);--> statement-breakpoint
CREATE INDEX `service_requests_unit_idx` ON `service_requests` (`unit_id`);--> statement-breakpoint
CREATE INDEX `service_requests_frame_idx` ON `service_requests` (`frame_code`);--> statement-breakpoint
CREATE INDEX `service_requests_received_by_idx` ON `service_requests` (`received_by`);--> statement-breakpoint
CREATE INDEX `service_requests_inspected_by_idx` ON `service_requests` (`inspected_by`);--> statement-breakpoint
CREATE INDEX `service_requests_quoted_by_idx` ON `service_requests` (`quoted_by`);--> statement-breakpoint
CREATE INDEX `service_requests_rebuilt_by_idx` ON `service_requests` (`rebuilt_by`);--> statement-breakpoint
CREATE INDEX `service_requests_shipped_by_idx` ON `service_requests` (`shipped_by`);--> statement-breakpoint
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
	CONSTRAINT "mail_outbox_kind_ck" CHECK(kind IN ('order-confirmation', 'payment-failed', 'back-order', 'short-pick', 'dispatch', 'return-decision', 'dealer-application-received', 'dealer-approved', 'dealer-declined', 'password-reset', 'account-confirm', 'existing-account-notice', 'order-changed', 'service-reminder', 'service-booked', 'service-quote', 'service-decision', 'service-shipped')),
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
CREATE INDEX `mail_outbox_created_idx` ON `mail_outbox` (`created_at`);--> statement-breakpoint
CREATE TABLE `__new_notices` (
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
	CONSTRAINT "notices_kind_ck" CHECK(kind IN ('paid', 'on-account', 'picking', 'back-ordered', 'dispatched', 'return-decided', 'service-due', 'service'))
);
--> statement-breakpoint
INSERT INTO `__new_notices`("id", "user_id", "order_id", "kind", "title", "body", "link", "read_at", "created_at") SELECT "id", "user_id", "order_id", "kind", "title", "body", "link", "read_at", "created_at" FROM `notices`;--> statement-breakpoint
DROP TABLE `notices`;--> statement-breakpoint
ALTER TABLE `__new_notices` RENAME TO `notices`;--> statement-breakpoint
CREATE INDEX `notices_user_idx` ON `notices` (`user_id`,`id`);--> statement-breakpoint
CREATE INDEX `notices_unread_idx` ON `notices` (`user_id`,`read_at`);--> statement-breakpoint
CREATE INDEX `notices_order_idx` ON `notices` (`order_id`);--> statement-breakpoint
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
	CONSTRAINT "stock_movements_kind_ck" CHECK(kind IN ('goods-in', 'reserve', 'release', 'pick', 'dispatch', 'adjustment', 'return', 'workshop'))
);
--> statement-breakpoint
INSERT INTO `__new_stock_movements`("id", "part_id", "bin_code", "kind", "on_hand_delta", "reserved_delta", "order_id", "note", "created_at") SELECT "id", "part_id", "bin_code", "kind", "on_hand_delta", "reserved_delta", "order_id", "note", "created_at" FROM `stock_movements`;--> statement-breakpoint
DROP TABLE `stock_movements`;--> statement-breakpoint
ALTER TABLE `__new_stock_movements` RENAME TO `stock_movements`;--> statement-breakpoint
CREATE INDEX `stock_movements_part_idx` ON `stock_movements` (`part_id`,`bin_code`);--> statement-breakpoint
CREATE INDEX `stock_movements_order_idx` ON `stock_movements` (`order_id`);--> statement-breakpoint
CREATE INDEX `stock_movements_bin_idx` ON `stock_movements` (`bin_code`);