-- Which reading of the trade's spellings (src/lib/search/normalise-terms.ts) the rows of pages_fts
-- were written with. The triggers of 0001 still index the raw text of every change, so a page is
-- always findable by its words; the application then rewrites the row with the joined spellings
-- in the same transaction, and at start-up rebuilds every row when this number is behind its own.
CREATE TABLE `search_index_state` (
	`id` integer PRIMARY KEY NOT NULL CHECK (`id` = 1),
	`version` integer NOT NULL
);
--> statement-breakpoint
INSERT INTO `search_index_state` (`id`, `version`) VALUES (1, 0);
