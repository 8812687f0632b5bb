CREATE TABLE `mail_outbox` (
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
	CONSTRAINT "mail_outbox_kind_ck" CHECK(kind IN ('order-confirmation', 'payment-failed', 'back-order', 'short-pick', 'dispatch', 'return-decision', 'dealer-application-received', 'dealer-approved', 'dealer-declined', 'password-reset', 'account-confirm', 'existing-account-notice')),
	CONSTRAINT "mail_outbox_state_ck" CHECK(state IN ('queued', 'sending', 'sent', 'failed')),
	CONSTRAINT "mail_outbox_attempts_ck" CHECK(attempts >= 0),
	CONSTRAINT "mail_outbox_sent_ck" CHECK(state <> 'sent' OR sent_at IS NOT NULL)
);
--> statement-breakpoint
CREATE INDEX `mail_outbox_due_idx` ON `mail_outbox` (`state`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `mail_outbox_created_idx` ON `mail_outbox` (`created_at`);