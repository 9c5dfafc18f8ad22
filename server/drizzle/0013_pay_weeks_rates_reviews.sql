CREATE TABLE `held_punches` (
	`id` text PRIMARY KEY NOT NULL,
	`technician_id` integer NOT NULL,
	`kind` text NOT NULL,
	`job_line_id` integer,
	`break_kind` text,
	`at` integer NOT NULL,
	`recorded_at` integer NOT NULL,
	`recorded_by` integer NOT NULL,
	`displaces` text NOT NULL,
	`held_because` text NOT NULL,
	`review` text DEFAULT 'pending' NOT NULL,
	`resolved_at` integer,
	`resolved_by` integer,
	`resolution` text,
	FOREIGN KEY (`technician_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`job_line_id`) REFERENCES `job_lines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`resolved_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `held_punches_technician_id_at_idx` ON `held_punches` (`technician_id`,`at`);--> statement-breakpoint
CREATE TABLE `exception_reviews` (
	`key` text PRIMARY KEY NOT NULL,
	`technician_id` integer NOT NULL,
	`reviewed_by` integer NOT NULL,
	`reviewed_at` integer NOT NULL,
	`note` text NOT NULL,
	FOREIGN KEY (`technician_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`reviewed_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `exception_reviews_technician_id_idx` ON `exception_reviews` (`technician_id`);--> statement-breakpoint
CREATE TABLE `pay_rates` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` integer NOT NULL,
	`effective_from` text NOT NULL,
	`pay_type` text NOT NULL,
	`flat_rate_cents` integer NOT NULL,
	`hourly_rate_cents` integer NOT NULL,
	`guarantee_cents` integer NOT NULL,
	`overtime_exempt` integer NOT NULL,
	`recorded_at` integer NOT NULL,
	`recorded_by` integer,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `pay_rates_user_id_effective_from_idx` ON `pay_rates` (`user_id`,`effective_from`);--> statement-breakpoint
CREATE TABLE `pay_rules` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`effective_from` text NOT NULL,
	`overtime_rules` text NOT NULL,
	`minimum_wage_cents` integer NOT NULL,
	`local_minimum_wage_cents` integer,
	`pay_non_productive_separately` integer NOT NULL,
	`recorded_at` integer NOT NULL,
	`recorded_by` integer,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `pay_rules_effective_from_idx` ON `pay_rules` (`effective_from`);--> statement-breakpoint
CREATE TABLE `pay_weeks` (
	`week` text PRIMARY KEY NOT NULL,
	`closed_at` integer,
	`closed_by` integer,
	`snapshot` text,
	`reopened_at` integer,
	`reopened_by` integer,
	`reopen_reason` text,
	FOREIGN KEY (`closed_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`reopened_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `minimum_meal_minutes` integer DEFAULT 30 NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `long_shift_hours` integer DEFAULT 14 NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `minimum_clocked_minutes_for_done` integer DEFAULT 6 NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `minimum_clocked_hours_for_efficiency` integer DEFAULT 8 NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `apportion_spanning_lines` integer DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `kiosk_shows_pay` integer DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE `job_lines` ADD `sign_off` text;--> statement-breakpoint
ALTER TABLE `job_lines` ADD `signed_off_by` integer REFERENCES users(id);--> statement-breakpoint
ALTER TABLE `job_lines` ADD `signed_off_at` integer;--> statement-breakpoint
ALTER TABLE `job_lines` ADD `sign_off_reason` text;--> statement-breakpoint
ALTER TABLE `punches` ADD `voids` integer DEFAULT false NOT NULL;