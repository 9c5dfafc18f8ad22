CREATE TABLE `pending_upgrades` (
	`name` text PRIMARY KEY NOT NULL
);
--> statement-breakpoint
INSERT INTO `pending_upgrades` (`name`) VALUES ('record-implied-job-offs');
