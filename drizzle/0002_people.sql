CREATE TABLE `guest_passes` (
	`id` text PRIMARY KEY NOT NULL,
	`venue_id` text NOT NULL,
	`label` text NOT NULL,
	`token_hash` text NOT NULL,
	`expires_at` integer NOT NULL,
	`revoked_at` integer,
	`last_used_at` integer,
	`use_count` integer DEFAULT 0 NOT NULL,
	`created_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`venue_id`) REFERENCES `venues`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `guest_passes_token_hash_unique` ON `guest_passes` (`token_hash`);--> statement-breakpoint
CREATE INDEX `guest_passes_venue_idx` ON `guest_passes` (`venue_id`);--> statement-breakpoint
CREATE TABLE `invitations` (
	`id` text PRIMARY KEY NOT NULL,
	`venue_id` text NOT NULL,
	`email` text NOT NULL,
	`role` text NOT NULL,
	`token_hash` text NOT NULL,
	`expires_at` integer NOT NULL,
	`accepted_at` integer,
	`revoked_at` integer,
	`invited_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`venue_id`) REFERENCES `venues`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`invited_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `invitations_token_hash_unique` ON `invitations` (`token_hash`);--> statement-breakpoint
CREATE INDEX `invitations_venue_idx` ON `invitations` (`venue_id`);--> statement-breakpoint
CREATE TABLE `throttle_counters` (
	`key` text PRIMARY KEY NOT NULL,
	`count` integer DEFAULT 0 NOT NULL,
	`reset_at` integer NOT NULL
);
--> statement-breakpoint
ALTER TABLE `users` ADD `session_epoch` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `memberships` ADD `last_visit_at` integer;--> statement-breakpoint
ALTER TABLE `memberships` ADD `visit_started_at` integer;--> statement-breakpoint
ALTER TABLE `venues` ADD `check_stale_months` integer DEFAULT 6 NOT NULL;--> statement-breakpoint
ALTER TABLE `pages` ADD `advance_position` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `pages` ADD `checked_at` integer;--> statement-breakpoint
ALTER TABLE `pages` ADD `checked_by` text REFERENCES users(id) ON DELETE SET NULL;--> statement-breakpoint
ALTER TABLE `pages` ADD `archived_at` integer;