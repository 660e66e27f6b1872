ALTER TABLE `player_profiles` ADD `skipped_kicks` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `players` ADD `erased_at` text;--> statement-breakpoint
ALTER TABLE `refresh_tokens` ADD `family_expires_at` text;