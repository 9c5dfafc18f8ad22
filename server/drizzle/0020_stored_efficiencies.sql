CREATE TABLE `stored_efficiencies` (
	`id` integer PRIMARY KEY NOT NULL,
	`counted_at` integer NOT NULL,
	`minimum_hours` real NOT NULL,
	`shop` real,
	`by_technician` text NOT NULL
);
