CREATE TABLE `account_tokens` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`kind` text NOT NULL,
	`token_hash` text NOT NULL,
	`expires_at` text NOT NULL,
	`used_at` text,
	`created_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `account_tokens_hash_uq` ON `account_tokens` (`token_hash`);--> statement-breakpoint
CREATE INDEX `account_tokens_user_idx` ON `account_tokens` (`user_id`);--> statement-breakpoint
CREATE TABLE `captured_mail` (
	`id` text PRIMARY KEY NOT NULL,
	`from_address` text NOT NULL,
	`to_json` text NOT NULL,
	`subject` text NOT NULL,
	`text_body` text NOT NULL,
	`html_body` text,
	`headers_json` text NOT NULL,
	`attachment_count` integer DEFAULT 0 NOT NULL,
	`received_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL
);
--> statement-breakpoint
CREATE INDEX `captured_mail_received_idx` ON `captured_mail` (`received_at`);--> statement-breakpoint
ALTER TABLE `clubs` ADD `digest_weekday` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `clubs` ADD `digest_time` text DEFAULT '07:00' NOT NULL;--> statement-breakpoint
ALTER TABLE `guardian_links` ADD `consent_text_version` text;--> statement-breakpoint
ALTER TABLE `guardian_links` ADD `consent_withdrawn_at` text;--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `headers_json` text;--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `attachments_json` text;--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `next_attempt_at` text;--> statement-breakpoint
ALTER TABLE `players` ADD `digest_self_opt_in` integer DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `users` ADD `invited_at` text;