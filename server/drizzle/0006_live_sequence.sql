CREATE TABLE `live_sequence` (
	`id` integer PRIMARY KEY NOT NULL,
	`reserved_up_to` integer NOT NULL
);
