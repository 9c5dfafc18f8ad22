ALTER TABLE `job_lines` ADD `completed_by` integer REFERENCES users(id);--> statement-breakpoint
ALTER TABLE `job_lines` ADD `concern` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `job_lines` ADD `cause` text;--> statement-breakpoint
ALTER TABLE `job_lines` ADD `correction` text;--> statement-breakpoint
ALTER TABLE `job_lines` ADD `cancel_reason` text;