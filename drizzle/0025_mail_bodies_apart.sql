CREATE TABLE `mail_bodies` (
	`outbox_id` integer PRIMARY KEY NOT NULL,
	`text` text NOT NULL,
	`html` text NOT NULL,
	FOREIGN KEY (`outbox_id`) REFERENCES `mail_outbox`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
INSERT INTO `mail_bodies` (`outbox_id`, `text`, `html`) SELECT `id`, `text`, `html` FROM `mail_outbox`;--> statement-breakpoint
ALTER TABLE `mail_outbox` DROP COLUMN `text`;--> statement-breakpoint
ALTER TABLE `mail_outbox` DROP COLUMN `html`;