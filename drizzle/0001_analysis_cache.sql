CREATE TABLE `player_profiles` (
	`player_id` text NOT NULL,
	`technique` text NOT NULL,
	`kicks_seq` integer NOT NULL,
	`repetitions` integer NOT NULL,
	`profile_json` text,
	`cloud_json` text,
	`reliable_reach_m` real,
	`reach_radius_m` real NOT NULL,
	`computed_at` text NOT NULL,
	PRIMARY KEY(`player_id`, `technique`),
	FOREIGN KEY (`player_id`) REFERENCES `players`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
ALTER TABLE `kicks` ADD `still_air_carry_m` real;--> statement-breakpoint
CREATE INDEX `kicks_player_technique_seq_idx` ON `kicks` (`player_id`,`technique`,`change_seq`);