-- GTIN-13 for every part (shared/gtin.ts): our company prefix 24731, inside GS1's restricted-circulation range
-- (prefixes 200-299, for numbers used only inside a company, so none can be a real maker's), the part id as a
-- seven-digit item reference, and the GS1 check digit: weights 1 and 3 from the left over the 12 digits (3 on the
-- rightmost), the sum taken up to the next multiple of ten. Existing parts get theirs from their id; a part inserted
-- without one (a price import's new part, a test's row) gets it the same way, and nothing can store a malformed one.
UPDATE `parts` SET `gtin` = ('24731' || printf('%07d', `id`)) || ((10 - ((CAST(substr(('24731' || printf('%07d', `id`)), 1, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', `id`)), 3, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', `id`)), 5, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', `id`)), 7, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', `id`)), 9, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', `id`)), 11, 1) AS INTEGER) + 3 * (CAST(substr(('24731' || printf('%07d', `id`)), 2, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', `id`)), 4, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', `id`)), 6, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', `id`)), 8, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', `id`)), 10, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', `id`)), 12, 1) AS INTEGER))) % 10)) % 10) WHERE `gtin` IS NULL;
--> statement-breakpoint
CREATE TRIGGER `parts_gtin_fill` AFTER INSERT ON `parts` WHEN new.`gtin` IS NULL BEGIN
  UPDATE `parts` SET `gtin` = ('24731' || printf('%07d', new.`id`)) || ((10 - ((CAST(substr(('24731' || printf('%07d', new.`id`)), 1, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 3, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 5, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 7, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 9, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 11, 1) AS INTEGER) + 3 * (CAST(substr(('24731' || printf('%07d', new.`id`)), 2, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 4, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 6, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 8, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 10, 1) AS INTEGER) + CAST(substr(('24731' || printf('%07d', new.`id`)), 12, 1) AS INTEGER))) % 10)) % 10) WHERE `id` = new.`id`;
END;
--> statement-breakpoint
CREATE TRIGGER `parts_gtin_insert_ck` BEFORE INSERT ON `parts` WHEN new.`gtin` IS NOT NULL AND (length(new.`gtin`) != 13 OR new.`gtin` GLOB '*[^0-9]*') BEGIN
  SELECT RAISE(ABORT, 'a GTIN is 13 digits');
END;
--> statement-breakpoint
CREATE TRIGGER `parts_gtin_update_ck` BEFORE UPDATE OF `gtin` ON `parts` WHEN new.`gtin` IS NULL OR length(new.`gtin`) != 13 OR new.`gtin` GLOB '*[^0-9]*' BEGIN
  SELECT RAISE(ABORT, 'a GTIN is 13 digits');
END;
