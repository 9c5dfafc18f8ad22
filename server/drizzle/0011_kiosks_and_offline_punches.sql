CREATE TABLE `offline_punches` (
	`id` text PRIMARY KEY NOT NULL,
	`kiosk_id` integer NOT NULL,
	`badge` text,
	`technician_id` integer,
	`kind` text NOT NULL,
	`break_kind` text,
	`at` integer NOT NULL,
	`status` text NOT NULL,
	`problem` text,
	`received_at` integer NOT NULL,
	`decided_at` integer,
	`decided_by` integer,
	FOREIGN KEY (`kiosk_id`) REFERENCES `screens`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`technician_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`decided_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `offline_punches_status_at_idx` ON `offline_punches` (`status`,`at`);--> statement-breakpoint
CREATE INDEX `offline_punches_technician_id_status_idx` ON `offline_punches` (`technician_id`,`status`);--> statement-breakpoint
ALTER TABLE `screens` ADD `kind` text DEFAULT 'wall' NOT NULL;--> statement-breakpoint
ALTER TABLE `screens` ADD `queue_waiting` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `screens` ADD `queue_since` integer;--> statement-breakpoint
ALTER TABLE `screens` ADD `queue_reported_at` integer;