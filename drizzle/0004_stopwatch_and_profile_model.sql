ALTER TABLE `clubs` ADD `timing_bias_s` real DEFAULT 0.2 NOT NULL;--> statement-breakpoint
ALTER TABLE `clubs` ADD `timing_sd_s` real DEFAULT 0.08 NOT NULL;--> statement-breakpoint
ALTER TABLE `kicks` ADD `hang_time_s` real;--> statement-breakpoint
ALTER TABLE `player_profiles` ADD `reach_curve_json` text;--> statement-breakpoint
ALTER TABLE `player_profiles` ADD `model_version` integer DEFAULT 1 NOT NULL;