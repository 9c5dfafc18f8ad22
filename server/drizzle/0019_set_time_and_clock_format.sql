PRAGMA foreign_keys=OFF;--> statement-breakpoint
CREATE TABLE `__new_timers` (
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
	FOREIGN KEY (`started_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "timers_kind_check" CHECK("kind" in ('warm-up', 'cool-down', 'set-time'))
);
--> statement-breakpoint
INSERT INTO `__new_timers`("id", "bay_id", "job_line_id", "kind", "target_c", "ambient_c", "duration_seconds", "label", "started_at", "started_by", "reached_at", "ended_at") SELECT "id", "bay_id", "job_line_id", CASE "kind" WHEN 'hold' THEN 'set-time' ELSE "kind" END, "target_c", "ambient_c", "duration_seconds", "label", "started_at", "started_by", "reached_at", "ended_at" FROM `timers`;--> statement-breakpoint
DROP TABLE `timers`;--> statement-breakpoint
ALTER TABLE `__new_timers` RENAME TO `timers`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
CREATE INDEX `timers_bay_id_ended_at_idx` ON `timers` (`bay_id`,`ended_at`);--> statement-breakpoint
CREATE TABLE `__new_shop_settings` (
	`id` integer PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`time_zone` text NOT NULL,
	`workweek_start_day` integer NOT NULL,
	`workweek_start_hour` integer NOT NULL,
	`units` text NOT NULL,
	`clock_format` text DEFAULT '12h' NOT NULL,
	`max_concurrent_jobs` integer NOT NULL,
	`concurrent_split` text NOT NULL,
	`opening_hours` text NOT NULL,
	`kiosk_idle_seconds` integer NOT NULL,
	`minimum_meal_minutes` integer DEFAULT 30 NOT NULL,
	`long_shift_hours` integer DEFAULT 14 NOT NULL,
	`minimum_clocked_minutes_for_done` integer DEFAULT 6 NOT NULL,
	`minimum_clocked_hours_for_efficiency` integer DEFAULT 8 NOT NULL,
	`apportion_spanning_lines` integer DEFAULT true NOT NULL,
	`kiosk_shows_pay` integer DEFAULT true NOT NULL,
	`technicians_take_unassigned` integer DEFAULT true NOT NULL,
	`phone` text,
	`labour_rate_cents` integer DEFAULT 0 NOT NULL,
	`tax_note` text DEFAULT '' NOT NULL,
	`approval_link_hours` integer DEFAULT 72 NOT NULL,
	`updated_at` integer NOT NULL,
	CONSTRAINT "shop_settings_units_check" CHECK("units" in ('metric', 'us')),
	CONSTRAINT "shop_settings_concurrent_split_check" CHECK("concurrent_split" in ('even', 'full')),
	CONSTRAINT "shop_settings_clock_format_check" CHECK("clock_format" in ('12h', '24h'))
);
--> statement-breakpoint
INSERT INTO `__new_shop_settings`("id", "name", "time_zone", "workweek_start_day", "workweek_start_hour", "units", "clock_format", "max_concurrent_jobs", "concurrent_split", "opening_hours", "kiosk_idle_seconds", "minimum_meal_minutes", "long_shift_hours", "minimum_clocked_minutes_for_done", "minimum_clocked_hours_for_efficiency", "apportion_spanning_lines", "kiosk_shows_pay", "technicians_take_unassigned", "phone", "labour_rate_cents", "tax_note", "approval_link_hours", "updated_at") SELECT "id", "name", "time_zone", "workweek_start_day", "workweek_start_hour", "units", '12h', "max_concurrent_jobs", "concurrent_split", "opening_hours", "kiosk_idle_seconds", "minimum_meal_minutes", "long_shift_hours", "minimum_clocked_minutes_for_done", "minimum_clocked_hours_for_efficiency", "apportion_spanning_lines", "kiosk_shows_pay", "technicians_take_unassigned", "phone", "labour_rate_cents", "tax_note", "approval_link_hours", "updated_at" FROM `shop_settings`;--> statement-breakpoint
DROP TABLE `shop_settings`;--> statement-breakpoint
ALTER TABLE `__new_shop_settings` RENAME TO `shop_settings`;