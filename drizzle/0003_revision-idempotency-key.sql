ALTER TABLE `revisions` ADD `idempotency_key` text;--> statement-breakpoint
CREATE UNIQUE INDEX `revisions_page_idempotency_idx` ON `revisions` (`page_id`,`idempotency_key`);