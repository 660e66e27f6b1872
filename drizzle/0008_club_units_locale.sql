ALTER TABLE `clubs` ADD `distance_unit` text DEFAULT 'm' NOT NULL;--> statement-breakpoint
ALTER TABLE `clubs` ADD `locale` text DEFAULT 'en-GB' NOT NULL;