-- Full-text search over each page's title and the plain text of its CURRENT revision.
-- Triggers keep the index inside the same transaction as every change to pages and revisions,
-- whichever code makes it (saves, restores, the demo seed, renames, cascaded deletes).
-- page_search_keys gives each page a stable integer for the FTS rowid (a text-keyed table's own
-- rowid may change on VACUUM), so every update finds its index row through a primary key.
CREATE TABLE `page_search_keys` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`page_id` text NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `page_search_keys_page_idx` ON `page_search_keys` (`page_id`);
--> statement-breakpoint
CREATE VIRTUAL TABLE `pages_fts` USING fts5(title, body, tokenize = 'unicode61 remove_diacritics 2');
--> statement-breakpoint
CREATE TRIGGER `pages_fts_after_insert` AFTER INSERT ON `pages` BEGIN
  INSERT INTO page_search_keys(page_id) VALUES (new.id);
  INSERT INTO pages_fts(rowid, title, body)
  VALUES (
    (SELECT id FROM page_search_keys WHERE page_id = new.id),
    new.title,
    coalesce((SELECT plain_text FROM revisions WHERE page_id = new.id AND number = new.current_revision), '')
  );
END;
--> statement-breakpoint
CREATE TRIGGER `pages_fts_after_update` AFTER UPDATE OF title, current_revision ON `pages` BEGIN
  UPDATE pages_fts
  SET title = new.title,
      body = coalesce((SELECT plain_text FROM revisions WHERE page_id = new.id AND number = new.current_revision), '')
  WHERE rowid = (SELECT id FROM page_search_keys WHERE page_id = new.id);
END;
--> statement-breakpoint
CREATE TRIGGER `pages_fts_after_delete` AFTER DELETE ON `pages` BEGIN
  DELETE FROM pages_fts WHERE rowid = (SELECT id FROM page_search_keys WHERE page_id = old.id);
  DELETE FROM page_search_keys WHERE page_id = old.id;
END;
--> statement-breakpoint
-- A revision inserted after its page already points at it (as the seed does).
CREATE TRIGGER `pages_fts_after_revision` AFTER INSERT ON `revisions`
WHEN new.number = (SELECT current_revision FROM pages WHERE id = new.page_id) BEGIN
  UPDATE pages_fts SET body = new.plain_text
  WHERE rowid = (SELECT id FROM page_search_keys WHERE page_id = new.page_id);
END;
--> statement-breakpoint
INSERT INTO page_search_keys(page_id) SELECT id FROM pages ORDER BY created_at;
--> statement-breakpoint
INSERT INTO pages_fts(rowid, title, body)
SELECT k.id, p.title, coalesce(r.plain_text, '')
FROM pages p
JOIN page_search_keys k ON k.page_id = p.id
LEFT JOIN revisions r ON r.page_id = p.id AND r.number = p.current_revision;
