CREATE INDEX `pages_venue_section_title_idx` ON `pages` (`venue_id`,`section_id`,`title`,`slug`);--> statement-breakpoint
CREATE INDEX `pages_venue_updated_idx` ON `pages` (`venue_id`,`updated_at`);