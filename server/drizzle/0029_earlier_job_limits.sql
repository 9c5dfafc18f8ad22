CREATE TABLE `earlier_job_limits` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`until` integer NOT NULL,
	`max_concurrent_jobs` integer NOT NULL
);
