-- Full-text index for words (drizzle-kit cannot model FTS5). Rows are written by server/services/search-index.ts.
CREATE VIRTUAL TABLE `parts_fts` USING fts5(`part_id` UNINDEXED, `title`, `body`, tokenize = 'unicode61 remove_diacritics 2', prefix = '2 3');
--> statement-breakpoint
-- Trigram index over normalised part numbers and their aliases, to find near misses (a digit swapped or dropped).
CREATE VIRTUAL TABLE `numbers_tri` USING fts5(`part_id` UNINDEXED, `kind` UNINDEXED, `number`, tokenize = 'trigram');
