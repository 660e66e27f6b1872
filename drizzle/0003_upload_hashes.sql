ALTER TABLE `uploads` ADD `content_hash` text;--> statement-breakpoint
ALTER TABLE `uploads` ADD `summary_json` text;--> statement-breakpoint
CREATE INDEX `uploads_hash_idx` ON `uploads` (`club_id`,`kind`,`content_hash`);