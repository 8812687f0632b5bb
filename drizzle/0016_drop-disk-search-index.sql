-- The search index lives in each process's memory now (server/services/search-index.ts), built from the catalogue
-- tables and kept current through the change log: the full-text tables on disk and their build marker go.
DROP TABLE IF EXISTS `parts_fts`;
--> statement-breakpoint
DROP TABLE IF EXISTS `numbers_tri`;
--> statement-breakpoint
DELETE FROM `meta` WHERE `key` = 'search_index';
