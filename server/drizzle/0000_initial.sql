CREATE TABLE `hold_presets` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`duration_seconds` integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE `operations` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`title` text NOT NULL,
	`default_book_hours` real NOT NULL,
	`skill_level` integer DEFAULT 1 NOT NULL,
	`active` integer DEFAULT true NOT NULL
);
--> statement-breakpoint
CREATE TABLE `shop_settings` (
	`id` integer PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`time_zone` text NOT NULL,
	`workweek_start_day` integer NOT NULL,
	`workweek_start_hour` integer NOT NULL,
	`units` text NOT NULL,
	`max_concurrent_jobs` integer NOT NULL,
	`concurrent_split` text NOT NULL,
	`minimum_wage_cents` integer NOT NULL,
	`overtime_rules` text NOT NULL,
	`opening_hours` text NOT NULL,
	`kiosk_idle_seconds` integer NOT NULL,
	`pay_non_productive_separately` integer NOT NULL,
	`updated_at` integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE `screens` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`pairing_code_hash` text,
	`pairing_expires_at` integer,
	`paired_at` integer,
	`last_seen_at` integer,
	`revoked_at` integer,
	`created_by` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `screens_pairing_code_hash_idx` ON `screens` (`pairing_code_hash`);--> statement-breakpoint
CREATE TABLE `users` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`role` text NOT NULL,
	`email` text,
	`password_hash` text,
	`badge` text,
	`pin_hash` text,
	`skill_level` integer DEFAULT 1 NOT NULL,
	`flat_rate_cents` integer DEFAULT 0 NOT NULL,
	`hourly_rate_cents` integer DEFAULT 0 NOT NULL,
	`overtime_exempt` integer DEFAULT false NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`created_at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `users_email_idx` ON `users` (`email`);--> statement-breakpoint
CREATE UNIQUE INDEX `users_badge_idx` ON `users` (`badge`);--> statement-breakpoint
CREATE TABLE `bays` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`kind` text DEFAULT 'two-post' NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`phase` text DEFAULT 'free' NOT NULL,
	`phase_since` integer NOT NULL,
	`repair_order_id` integer
);
--> statement-breakpoint
CREATE TABLE `customers` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`phone` text,
	`email` text,
	`created_at` integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE `job_lines` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`repair_order_id` integer NOT NULL,
	`line_no` integer NOT NULL,
	`title` text NOT NULL,
	`book_hours` real NOT NULL,
	`skill_level` integer DEFAULT 1 NOT NULL,
	`status` text DEFAULT 'queued' NOT NULL,
	`hold_reason` text,
	`held_at` integer,
	`priority` text DEFAULT 'normal' NOT NULL,
	`technician_id` integer,
	`bay_id` integer,
	`promised_at` integer,
	`queued_at` integer NOT NULL,
	`completed_at` integer,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`repair_order_id`) REFERENCES `repair_orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`technician_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`bay_id`) REFERENCES `bays`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `job_lines_repair_order_line_no_idx` ON `job_lines` (`repair_order_id`,`line_no`);--> statement-breakpoint
CREATE INDEX `job_lines_technician_id_idx` ON `job_lines` (`technician_id`);--> statement-breakpoint
CREATE INDEX `job_lines_bay_id_idx` ON `job_lines` (`bay_id`);--> statement-breakpoint
CREATE INDEX `job_lines_status_idx` ON `job_lines` (`status`);--> statement-breakpoint
CREATE TABLE `repair_orders` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`number` text NOT NULL,
	`customer_id` integer NOT NULL,
	`vehicle_id` integer NOT NULL,
	`advisor_id` integer,
	`concern` text NOT NULL,
	`odometer` integer NOT NULL,
	`status` text DEFAULT 'open' NOT NULL,
	`promised_at` integer,
	`created_at` integer NOT NULL,
	`closed_at` integer,
	FOREIGN KEY (`customer_id`) REFERENCES `customers`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`advisor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `repair_orders_number_idx` ON `repair_orders` (`number`);--> statement-breakpoint
CREATE INDEX `repair_orders_status_idx` ON `repair_orders` (`status`);--> statement-breakpoint
CREATE TABLE `vehicles` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`customer_id` integer NOT NULL,
	`vin` text NOT NULL,
	`year` integer NOT NULL,
	`make` text NOT NULL,
	`model` text NOT NULL,
	`plate` text,
	`last_odometer` integer,
	FOREIGN KEY (`customer_id`) REFERENCES `customers`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `vehicles_vin_idx` ON `vehicles` (`vin`);--> statement-breakpoint
CREATE TABLE `punches` (
	`id` text PRIMARY KEY NOT NULL,
	`technician_id` integer NOT NULL,
	`kind` text NOT NULL,
	`job_line_id` integer,
	`break_kind` text,
	`at` integer NOT NULL,
	`recorded_at` integer NOT NULL,
	`recorded_by` integer NOT NULL,
	`supersedes` text,
	`reason` text,
	FOREIGN KEY (`technician_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`job_line_id`) REFERENCES `job_lines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `punches_technician_id_at_idx` ON `punches` (`technician_id`,`at`);--> statement-breakpoint
CREATE INDEX `punches_job_line_id_idx` ON `punches` (`job_line_id`);--> statement-breakpoint
CREATE INDEX `punches_at_idx` ON `punches` (`at`);--> statement-breakpoint
CREATE TABLE `timer_readings` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`timer_id` integer NOT NULL,
	`temp_c` real NOT NULL,
	`at` integer NOT NULL,
	`recorded_by` integer NOT NULL,
	FOREIGN KEY (`timer_id`) REFERENCES `timers`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `timer_readings_timer_id_idx` ON `timer_readings` (`timer_id`);--> statement-breakpoint
CREATE TABLE `timers` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`bay_id` integer,
	`job_line_id` integer NOT NULL,
	`kind` text NOT NULL,
	`target_c` real,
	`ambient_c` real,
	`duration_seconds` integer,
	`label` text,
	`started_at` integer NOT NULL,
	`started_by` integer NOT NULL,
	`reached_at` integer,
	`ended_at` integer,
	FOREIGN KEY (`bay_id`) REFERENCES `bays`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`job_line_id`) REFERENCES `job_lines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`started_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `timers_bay_id_ended_at_idx` ON `timers` (`bay_id`,`ended_at`);--> statement-breakpoint
CREATE TABLE `attachments` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`finding_id` integer NOT NULL,
	`stored_name` text NOT NULL,
	`preview_name` text,
	`mime_type` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`finding_id`) REFERENCES `findings`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `attachments_finding_id_idx` ON `attachments` (`finding_id`);--> statement-breakpoint
CREATE TABLE `findings` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_line_id` integer NOT NULL,
	`technician_id` integer NOT NULL,
	`note` text NOT NULL,
	`severity` text NOT NULL,
	`suggested_hours` real,
	`answer` text DEFAULT 'pending' NOT NULL,
	`answered_by` integer,
	`answered_at` integer,
	`created_line_id` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`job_line_id`) REFERENCES `job_lines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`technician_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`answered_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_line_id`) REFERENCES `job_lines`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `findings_job_line_id_idx` ON `findings` (`job_line_id`);--> statement-breakpoint
CREATE INDEX `findings_answer_idx` ON `findings` (`answer`);--> statement-breakpoint
CREATE TABLE `audit_log` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`at` integer NOT NULL,
	`actor_id` integer,
	`action` text NOT NULL,
	`entity` text NOT NULL,
	`entity_id` text NOT NULL,
	`detail` text,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `audit_log_entity_entity_id_idx` ON `audit_log` (`entity`,`entity_id`);--> statement-breakpoint
CREATE TABLE `mail_outbox` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`recipient` text NOT NULL,
	`subject` text NOT NULL,
	`text` text NOT NULL,
	`attachments` text,
	`status` text DEFAULT 'queued' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`next_attempt_at` integer NOT NULL,
	`last_error` text,
	`created_at` integer NOT NULL,
	`sent_at` integer
);
--> statement-breakpoint
CREATE INDEX `mail_outbox_status_next_attempt_at_idx` ON `mail_outbox` (`status`,`next_attempt_at`);