ALTER TABLE `kicks` ADD `measured_source` text;--> statement-breakpoint
ALTER TABLE `kicks` ADD `video_track_json` text;--> statement-breakpoint
-- Every measured value stored before this migration came from a device import (video had no route in).
UPDATE `kicks` SET `measured_source` = 'device' WHERE `measured_speed_ms` IS NOT NULL OR `launch_angle_deg` IS NOT NULL OR `measured_spin_rps` IS NOT NULL;
