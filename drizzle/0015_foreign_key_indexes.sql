CREATE INDEX `audit_log_part_id_idx` ON `audit_log` (`part_id`);--> statement-breakpoint
CREATE INDEX `notices_order_idx` ON `notices` (`order_id`);--> statement-breakpoint
CREATE INDEX `price_imports_applied_by_idx` ON `price_imports` (`applied_by`);