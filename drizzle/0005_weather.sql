CREATE TABLE `ground_conditions` (
	`ground_id` text PRIMARY KEY NOT NULL,
	`latitude` real NOT NULL,
	`longitude` real NOT NULL,
	`fetched_at` text NOT NULL,
	`observed_at` text NOT NULL,
	`temperature_c` real NOT NULL,
	`relative_humidity_pct` real NOT NULL,
	`pressure_hpa` real NOT NULL,
	`wind_speed_ms` real NOT NULL,
	`wind_from_bearing_deg` real NOT NULL,
	FOREIGN KEY (`ground_id`) REFERENCES `training_grounds`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
ALTER TABLE `training_sessions` ADD `conditions_observed_at` text;