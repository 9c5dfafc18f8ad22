CREATE TABLE `sign_in_throttles` (
	`key` text PRIMARY KEY NOT NULL,
	`failures` integer NOT NULL,
	`lock_step` integer NOT NULL,
	`locked_until` integer,
	`last_attempt_at` integer NOT NULL
);
--> statement-breakpoint
CREATE INDEX `sign_in_throttles_last_attempt_at_idx` ON `sign_in_throttles` (`last_attempt_at`);