CREATE TABLE `applied_mutations` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`device_id` text,
	`entity` text NOT NULL,
	`entity_id` text NOT NULL,
	`status` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `applied_mutations_user_idx` ON `applied_mutations` (`user_id`);--> statement-breakpoint
CREATE TABLE `audit_log` (
	`id` text PRIMARY KEY NOT NULL,
	`club_id` text,
	`user_id` text,
	`action` text NOT NULL,
	`entity` text,
	`entity_id` text,
	`detail_json` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`club_id`) REFERENCES `clubs`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `audit_log_club_at_idx` ON `audit_log` (`club_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `change_counter` (
	`id` integer PRIMARY KEY NOT NULL,
	`last_seq` integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
CREATE TABLE `clubs` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`timezone` text DEFAULT 'Europe/London' NOT NULL,
	`rep_limit_per_session` integer DEFAULT 40 NOT NULL,
	`spin_steps_json` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `digest_runs` (
	`id` text PRIMARY KEY NOT NULL,
	`club_id` text NOT NULL,
	`kind` text NOT NULL,
	`period_start` text NOT NULL,
	`status` text DEFAULT 'running' NOT NULL,
	`sent_count` integer DEFAULT 0 NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`finished_at` text,
	FOREIGN KEY (`club_id`) REFERENCES `clubs`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `digest_runs_period_uq` ON `digest_runs` (`club_id`,`kind`,`period_start`);--> statement-breakpoint
CREATE TABLE `drills` (
	`id` text PRIMARY KEY NOT NULL,
	`club_id` text NOT NULL,
	`session_id` text NOT NULL,
	`technique` text NOT NULL,
	`target_distance_m` real NOT NULL,
	`target_radius_m` real NOT NULL,
	`lateral_offset_m` real DEFAULT 0 NOT NULL,
	`backspin_step` integer DEFAULT 0 NOT NULL,
	`sidespin_step` integer DEFAULT 0 NOT NULL,
	`label` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`deleted_at` text,
	`version` integer DEFAULT 1 NOT NULL,
	`change_seq` integer NOT NULL,
	FOREIGN KEY (`club_id`) REFERENCES `clubs`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`session_id`) REFERENCES `training_sessions`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `drills_session_idx` ON `drills` (`session_id`);--> statement-breakpoint
CREATE INDEX `drills_club_seq_idx` ON `drills` (`club_id`,`change_seq`);--> statement-breakpoint
CREATE TABLE `guardian_links` (
	`id` text PRIMARY KEY NOT NULL,
	`guardian_user_id` text NOT NULL,
	`player_id` text NOT NULL,
	`relationship` text DEFAULT 'guardian' NOT NULL,
	`consent_at` text,
	`consent_recorded_by` text,
	`digest_opt_in` integer DEFAULT false NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`guardian_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`player_id`) REFERENCES `players`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`consent_recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `guardian_links_pair_uq` ON `guardian_links` (`guardian_user_id`,`player_id`);--> statement-breakpoint
CREATE INDEX `guardian_links_player_idx` ON `guardian_links` (`player_id`);--> statement-breakpoint
CREATE TABLE `kicks` (
	`id` text PRIMARY KEY NOT NULL,
	`club_id` text NOT NULL,
	`session_id` text NOT NULL,
	`drill_id` text,
	`player_id` text NOT NULL,
	`technique` text NOT NULL,
	`foot` text NOT NULL,
	`backspin_step` integer DEFAULT 0 NOT NULL,
	`sidespin_step` integer DEFAULT 0 NOT NULL,
	`target_distance_m` real NOT NULL,
	`target_radius_m` real NOT NULL,
	`outcome` text NOT NULL,
	`carry_m` real,
	`lateral_m` real,
	`measured_speed_ms` real,
	`launch_angle_deg` real,
	`measured_spin_rps` real,
	`recorded_at` text NOT NULL,
	`recorded_by` text,
	`device_id` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`deleted_at` text,
	`version` integer DEFAULT 1 NOT NULL,
	`change_seq` integer NOT NULL,
	FOREIGN KEY (`club_id`) REFERENCES `clubs`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`session_id`) REFERENCES `training_sessions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`drill_id`) REFERENCES `drills`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`player_id`) REFERENCES `players`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `kicks_player_recorded_idx` ON `kicks` (`player_id`,`recorded_at`);--> statement-breakpoint
CREATE INDEX `kicks_session_idx` ON `kicks` (`session_id`);--> statement-breakpoint
CREATE INDEX `kicks_club_seq_idx` ON `kicks` (`club_id`,`change_seq`);--> statement-breakpoint
CREATE TABLE `mail_outbox` (
	`id` text PRIMARY KEY NOT NULL,
	`club_id` text,
	`kind` text NOT NULL,
	`dedupe_key` text NOT NULL,
	`to_address` text NOT NULL,
	`subject` text NOT NULL,
	`text_body` text NOT NULL,
	`html_body` text,
	`status` text DEFAULT 'queued' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`last_error` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`sent_at` text,
	FOREIGN KEY (`club_id`) REFERENCES `clubs`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `mail_outbox_dedupe_uq` ON `mail_outbox` (`dedupe_key`);--> statement-breakpoint
CREATE INDEX `mail_outbox_status_idx` ON `mail_outbox` (`status`);--> statement-breakpoint
CREATE TABLE `players` (
	`id` text PRIMARY KEY NOT NULL,
	`club_id` text NOT NULL,
	`squad_id` text NOT NULL,
	`user_id` text,
	`display_name` text NOT NULL,
	`shirt_number` integer,
	`dominant_foot` text DEFAULT 'right' NOT NULL,
	`birth_date` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`deleted_at` text,
	FOREIGN KEY (`club_id`) REFERENCES `clubs`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`squad_id`) REFERENCES `squads`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `players_squad_idx` ON `players` (`squad_id`);--> statement-breakpoint
CREATE INDEX `players_club_idx` ON `players` (`club_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `players_user_uq` ON `players` (`user_id`);--> statement-breakpoint
CREATE TABLE `refresh_tokens` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`family_id` text NOT NULL,
	`token_hash` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`expires_at` text NOT NULL,
	`revoked_at` text,
	`replaced_by_id` text,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `refresh_tokens_hash_uq` ON `refresh_tokens` (`token_hash`);--> statement-breakpoint
CREATE INDEX `refresh_tokens_family_idx` ON `refresh_tokens` (`family_id`);--> statement-breakpoint
CREATE TABLE `squad_staff` (
	`squad_id` text NOT NULL,
	`user_id` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	PRIMARY KEY(`squad_id`, `user_id`),
	FOREIGN KEY (`squad_id`) REFERENCES `squads`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `squad_staff_user_idx` ON `squad_staff` (`user_id`);--> statement-breakpoint
CREATE TABLE `squads` (
	`id` text PRIMARY KEY NOT NULL,
	`club_id` text NOT NULL,
	`name` text NOT NULL,
	`age_group` text NOT NULL,
	`ball_size` integer DEFAULT 5 NOT NULL,
	`ground_id` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`deleted_at` text,
	FOREIGN KEY (`club_id`) REFERENCES `clubs`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`ground_id`) REFERENCES `training_grounds`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `squads_club_idx` ON `squads` (`club_id`);--> statement-breakpoint
CREATE TABLE `training_grounds` (
	`id` text PRIMARY KEY NOT NULL,
	`club_id` text NOT NULL,
	`name` text NOT NULL,
	`latitude` real,
	`longitude` real,
	`altitude_m` real DEFAULT 0 NOT NULL,
	`kicking_bearing_deg` real DEFAULT 0 NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`club_id`) REFERENCES `clubs`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `training_grounds_club_idx` ON `training_grounds` (`club_id`);--> statement-breakpoint
CREATE TABLE `training_sessions` (
	`id` text PRIMARY KEY NOT NULL,
	`club_id` text NOT NULL,
	`squad_id` text NOT NULL,
	`ground_id` text,
	`started_at` text NOT NULL,
	`ended_at` text,
	`temperature_c` real,
	`altitude_m` real,
	`relative_humidity_pct` real,
	`pressure_hpa` real,
	`wind_speed_ms` real,
	`wind_from_deg` real,
	`ball_size` integer DEFAULT 5 NOT NULL,
	`conditions_source_json` text,
	`notes` text,
	`recorded_by` text,
	`device_id` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`deleted_at` text,
	`version` integer DEFAULT 1 NOT NULL,
	`change_seq` integer NOT NULL,
	FOREIGN KEY (`club_id`) REFERENCES `clubs`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`squad_id`) REFERENCES `squads`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`ground_id`) REFERENCES `training_grounds`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `training_sessions_squad_started_idx` ON `training_sessions` (`squad_id`,`started_at`);--> statement-breakpoint
CREATE INDEX `training_sessions_club_seq_idx` ON `training_sessions` (`club_id`,`change_seq`);--> statement-breakpoint
CREATE TABLE `uploads` (
	`id` text PRIMARY KEY NOT NULL,
	`club_id` text NOT NULL,
	`uploaded_by` text NOT NULL,
	`kind` text NOT NULL,
	`filename` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`content` text NOT NULL,
	`status` text DEFAULT 'uploaded' NOT NULL,
	`error` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`committed_at` text,
	FOREIGN KEY (`club_id`) REFERENCES `clubs`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`uploaded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `uploads_club_idx` ON `uploads` (`club_id`);--> statement-breakpoint
CREATE TABLE `users` (
	`id` text PRIMARY KEY NOT NULL,
	`club_id` text NOT NULL,
	`email` text NOT NULL,
	`display_name` text NOT NULL,
	`role` text NOT NULL,
	`password_hash` text,
	`disabled_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`club_id`) REFERENCES `clubs`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `users_email_uq` ON `users` (`email`);--> statement-breakpoint
CREATE INDEX `users_club_idx` ON `users` (`club_id`);