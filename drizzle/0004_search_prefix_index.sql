-- The same index with a prefix index for three-character prefixes: the search box asks for a
-- prefix only from three characters on, and without this every such query walks all the terms
-- that start with those letters. The triggers of 0001 name the table, so they keep working.
DROP TABLE `pages_fts`;
--> statement-breakpoint
CREATE VIRTUAL TABLE `pages_fts` USING fts5(title, body, tokenize = 'unicode61 remove_diacritics 2', prefix = '3');
--> statement-breakpoint
INSERT INTO pages_fts(rowid, title, body)
SELECT k.id, p.title, coalesce(r.plain_text, '')
FROM pages p
JOIN page_search_keys k ON k.page_id = p.id
LEFT JOIN revisions r ON r.page_id = p.id AND r.number = p.current_revision;
