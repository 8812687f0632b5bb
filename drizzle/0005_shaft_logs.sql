CREATE TABLE `shaft_logs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`saved_fitment_id` integer NOT NULL,
	`frame_code` text NOT NULL,
	`name` text NOT NULL,
	`boost_unit` text NOT NULL,
	`row_count` integer NOT NULL,
	`duration_s` real NOT NULL,
	`rows` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`saved_fitment_id`) REFERENCES `saved_fitments`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`frame_code`) REFERENCES `frames`(`code`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "shaft_logs_boost_unit_ck" CHECK(boost_unit IN ('kpa', 'psi', 'bar')),
	CONSTRAINT "shaft_logs_row_count_ck" CHECK(row_count BETWEEN 1 AND 10000),
	CONSTRAINT "shaft_logs_duration_ck" CHECK("shaft_logs"."duration_s" >= 0)
);
--> statement-breakpoint
CREATE INDEX `shaft_logs_fitment_idx` ON `shaft_logs` (`saved_fitment_id`,`created_at`);