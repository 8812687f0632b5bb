ALTER TABLE `parts` ADD `gtin` text;--> statement-breakpoint
CREATE UNIQUE INDEX `parts_gtin_uq` ON `parts` (`gtin`);