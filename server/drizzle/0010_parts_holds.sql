CREATE TABLE `parts_holds` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_line_id` integer NOT NULL,
	`part` text,
	`state` text,
	`supplier` text,
	`expected_at` integer,
	`received_at` integer,
	`received_by` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`job_line_id`) REFERENCES `job_lines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`received_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `parts_holds_open_job_line_id_idx` ON `parts_holds` (`job_line_id`) WHERE "parts_holds"."received_at" is null;--> statement-breakpoint
CREATE INDEX `parts_holds_job_line_id_idx` ON `parts_holds` (`job_line_id`);