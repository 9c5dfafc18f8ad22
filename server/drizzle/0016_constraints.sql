PRAGMA foreign_keys=OFF;--> statement-breakpoint
CREATE TABLE `__new_bays` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`kind` text DEFAULT 'two-post' NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`phase` text DEFAULT 'free' NOT NULL,
	`phase_since` integer NOT NULL,
	`repair_order_id` integer,
	FOREIGN KEY (`repair_order_id`) REFERENCES `repair_orders`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "bays_kind_check" CHECK("kind" in ('two-post', 'four-post', 'alignment', 'flat', 'pit')),
	CONSTRAINT "bays_phase_check" CHECK("phase" in ('free', 'staged', 'check', 'ready'))
);
--> statement-breakpoint
INSERT INTO `__new_bays`("id", "name", "kind", "position", "active", "phase", "phase_since", "repair_order_id") SELECT "id", "name", "kind", "position", "active", "phase", "phase_since", "repair_order_id" FROM `bays`;--> statement-breakpoint
DROP TABLE `bays`;--> statement-breakpoint
ALTER TABLE `__new_bays` RENAME TO `bays`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
CREATE UNIQUE INDEX `bays_name_idx` ON `bays` (`name`);--> statement-breakpoint
CREATE TABLE `__new_punches` (
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
	`voids` integer DEFAULT false NOT NULL,
	FOREIGN KEY (`technician_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`job_line_id`) REFERENCES `job_lines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`supersedes`) REFERENCES `punches`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "punches_kind_check" CHECK("kind" in ('shift-in', 'shift-out', 'break-start', 'break-end', 'job-on', 'job-off')),
	CONSTRAINT "punches_break_kind_check" CHECK("break_kind" in ('meal', 'rest'))
);
--> statement-breakpoint
INSERT INTO `__new_punches`("id", "technician_id", "kind", "job_line_id", "break_kind", "at", "recorded_at", "recorded_by", "supersedes", "reason", "voids") SELECT "id", "technician_id", "kind", "job_line_id", "break_kind", "at", "recorded_at", "recorded_by", "supersedes", "reason", "voids" FROM `punches`;--> statement-breakpoint
DROP TABLE `punches`;--> statement-breakpoint
ALTER TABLE `__new_punches` RENAME TO `punches`;--> statement-breakpoint
CREATE INDEX `punches_technician_id_at_idx` ON `punches` (`technician_id`,`at`);--> statement-breakpoint
CREATE INDEX `punches_job_line_id_at_idx` ON `punches` (`job_line_id`,`at`);--> statement-breakpoint
CREATE INDEX `punches_at_idx` ON `punches` (`at`);--> statement-breakpoint
CREATE UNIQUE INDEX `punches_supersedes_idx` ON `punches` (`supersedes`);--> statement-breakpoint
CREATE TABLE `__new_shop_settings` (
	`id` integer PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`time_zone` text NOT NULL,
	`workweek_start_day` integer NOT NULL,
	`workweek_start_hour` integer NOT NULL,
	`units` text NOT NULL,
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
	CONSTRAINT "shop_settings_concurrent_split_check" CHECK("concurrent_split" in ('even', 'full'))
);
--> statement-breakpoint
INSERT INTO `__new_shop_settings`("id", "name", "time_zone", "workweek_start_day", "workweek_start_hour", "units", "max_concurrent_jobs", "concurrent_split", "opening_hours", "kiosk_idle_seconds", "minimum_meal_minutes", "long_shift_hours", "minimum_clocked_minutes_for_done", "minimum_clocked_hours_for_efficiency", "apportion_spanning_lines", "kiosk_shows_pay", "technicians_take_unassigned", "phone", "labour_rate_cents", "tax_note", "approval_link_hours", "updated_at") SELECT "id", "name", "time_zone", "workweek_start_day", "workweek_start_hour", "units", "max_concurrent_jobs", "concurrent_split", "opening_hours", "kiosk_idle_seconds", "minimum_meal_minutes", "long_shift_hours", "minimum_clocked_minutes_for_done", "minimum_clocked_hours_for_efficiency", "apportion_spanning_lines", "kiosk_shows_pay", "technicians_take_unassigned", "phone", "labour_rate_cents", "tax_note", "approval_link_hours", "updated_at" FROM `shop_settings`;--> statement-breakpoint
DROP TABLE `shop_settings`;--> statement-breakpoint
ALTER TABLE `__new_shop_settings` RENAME TO `shop_settings`;--> statement-breakpoint
CREATE TABLE `__new_screens` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`kind` text DEFAULT 'wall' NOT NULL,
	`name` text NOT NULL,
	`pairing_code_hash` text,
	`pairing_expires_at` integer,
	`paired_at` integer,
	`last_seen_at` integer,
	`revoked_at` integer,
	`created_by` integer,
	`created_at` integer NOT NULL,
	`queue_waiting` integer DEFAULT 0 NOT NULL,
	`queue_since` integer,
	`queue_reported_at` integer,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "screens_kind_check" CHECK("kind" in ('wall', 'kiosk'))
);
--> statement-breakpoint
INSERT INTO `__new_screens`("id", "kind", "name", "pairing_code_hash", "pairing_expires_at", "paired_at", "last_seen_at", "revoked_at", "created_by", "created_at", "queue_waiting", "queue_since", "queue_reported_at") SELECT "id", "kind", "name", "pairing_code_hash", "pairing_expires_at", "paired_at", "last_seen_at", "revoked_at", "created_by", "created_at", "queue_waiting", "queue_since", "queue_reported_at" FROM `screens`;--> statement-breakpoint
DROP TABLE `screens`;--> statement-breakpoint
ALTER TABLE `__new_screens` RENAME TO `screens`;--> statement-breakpoint
CREATE UNIQUE INDEX `screens_pairing_code_hash_idx` ON `screens` (`pairing_code_hash`);--> statement-breakpoint
CREATE TABLE `__new_users` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`role` text NOT NULL,
	`email` text,
	`password_hash` text,
	`badge` text,
	`pin_hash` text,
	`skill_level` integer DEFAULT 1 NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`created_at` integer NOT NULL,
	CONSTRAINT "users_role_check" CHECK("role" in ('owner', 'foreman', 'advisor', 'technician', 'display', 'kiosk'))
);
--> statement-breakpoint
INSERT INTO `__new_users`("id", "name", "role", "email", "password_hash", "badge", "pin_hash", "skill_level", "active", "created_at") SELECT "id", "name", "role", "email", "password_hash", "badge", "pin_hash", "skill_level", "active", "created_at" FROM `users`;--> statement-breakpoint
DROP TABLE `users`;--> statement-breakpoint
ALTER TABLE `__new_users` RENAME TO `users`;--> statement-breakpoint
CREATE UNIQUE INDEX `users_email_idx` ON `users` (`email`);--> statement-breakpoint
CREATE UNIQUE INDEX `users_badge_idx` ON `users` (`badge`);--> statement-breakpoint
CREATE TABLE `__new_job_lines` (
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
	`completed_by` integer,
	`concern` text DEFAULT '' NOT NULL,
	`cause` text,
	`correction` text,
	`cancel_reason` text,
	`updated_at` integer NOT NULL,
	`sign_off` text,
	`signed_off_by` integer,
	`signed_off_at` integer,
	`sign_off_reason` text,
	FOREIGN KEY (`repair_order_id`) REFERENCES `repair_orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`technician_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`bay_id`) REFERENCES `bays`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`completed_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`signed_off_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "job_lines_status_check" CHECK("status" in ('queued', 'working', 'held', 'done', 'cancelled')),
	CONSTRAINT "job_lines_hold_reason_check" CHECK("hold_reason" in ('parts', 'approval', 'tooling', 'sublet', 'other')),
	CONSTRAINT "job_lines_priority_check" CHECK("priority" in ('low', 'normal', 'high', 'urgent'))
);
--> statement-breakpoint
INSERT INTO `__new_job_lines`("id", "repair_order_id", "line_no", "title", "book_hours", "skill_level", "status", "hold_reason", "held_at", "priority", "technician_id", "bay_id", "promised_at", "queued_at", "completed_at", "completed_by", "concern", "cause", "correction", "cancel_reason", "updated_at", "sign_off", "signed_off_by", "signed_off_at", "sign_off_reason") SELECT "id", "repair_order_id", "line_no", "title", "book_hours", "skill_level", "status", "hold_reason", "held_at", "priority", "technician_id", "bay_id", "promised_at", "queued_at", "completed_at", "completed_by", "concern", "cause", "correction", "cancel_reason", "updated_at", "sign_off", "signed_off_by", "signed_off_at", "sign_off_reason" FROM `job_lines`;--> statement-breakpoint
DROP TABLE `job_lines`;--> statement-breakpoint
ALTER TABLE `__new_job_lines` RENAME TO `job_lines`;--> statement-breakpoint
CREATE UNIQUE INDEX `job_lines_repair_order_line_no_idx` ON `job_lines` (`repair_order_id`,`line_no`);--> statement-breakpoint
CREATE INDEX `job_lines_technician_id_idx` ON `job_lines` (`technician_id`);--> statement-breakpoint
CREATE INDEX `job_lines_bay_id_idx` ON `job_lines` (`bay_id`);--> statement-breakpoint
CREATE INDEX `job_lines_status_idx` ON `job_lines` (`status`);--> statement-breakpoint
CREATE INDEX `job_lines_open_idx` ON `job_lines` (`repair_order_id`) WHERE "job_lines"."status" != 'done';--> statement-breakpoint
CREATE INDEX `job_lines_completed_at_idx` ON `job_lines` (`completed_at`);--> statement-breakpoint
CREATE TABLE `__new_repair_orders` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`number` text NOT NULL,
	`customer_id` integer NOT NULL,
	`vehicle_id` integer NOT NULL,
	`advisor_id` integer,
	`customer_name` text NOT NULL,
	`customer_phone` text,
	`customer_email` text,
	`vehicle_year` integer NOT NULL,
	`vehicle_make` text NOT NULL,
	`vehicle_model` text NOT NULL,
	`vehicle_plate` text,
	`concern` text NOT NULL,
	`odometer` integer NOT NULL,
	`status` text DEFAULT 'open' NOT NULL,
	`promised_at` integer,
	`created_at` integer NOT NULL,
	`closed_at` integer,
	`external_ref` text,
	FOREIGN KEY (`customer_id`) REFERENCES `customers`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`advisor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "repair_orders_status_check" CHECK("status" in ('open', 'done', 'closed'))
);
--> statement-breakpoint
INSERT INTO `__new_repair_orders`("id", "number", "customer_id", "vehicle_id", "advisor_id", "customer_name", "customer_phone", "customer_email", "vehicle_year", "vehicle_make", "vehicle_model", "vehicle_plate", "concern", "odometer", "status", "promised_at", "created_at", "closed_at", "external_ref") SELECT "id", "number", "customer_id", "vehicle_id", "advisor_id", "customer_name", "customer_phone", "customer_email", "vehicle_year", "vehicle_make", "vehicle_model", "vehicle_plate", "concern", "odometer", "status", "promised_at", "created_at", "closed_at", "external_ref" FROM `repair_orders`;--> statement-breakpoint
DROP TABLE `repair_orders`;--> statement-breakpoint
ALTER TABLE `__new_repair_orders` RENAME TO `repair_orders`;--> statement-breakpoint
CREATE UNIQUE INDEX `repair_orders_number_idx` ON `repair_orders` (`number`);--> statement-breakpoint
CREATE UNIQUE INDEX `repair_orders_external_ref_idx` ON `repair_orders` (`external_ref`);--> statement-breakpoint
CREATE INDEX `repair_orders_status_created_at_idx` ON `repair_orders` (`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `repair_orders_created_at_idx` ON `repair_orders` (`created_at`);--> statement-breakpoint
CREATE INDEX `repair_orders_advisor_id_created_at_idx` ON `repair_orders` (`advisor_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `repair_orders_promised_at_idx` ON `repair_orders` (`promised_at`);--> statement-breakpoint
CREATE INDEX `repair_orders_vehicle_id_created_at_idx` ON `repair_orders` (`vehicle_id`,`created_at`);--> statement-breakpoint
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
	CONSTRAINT "timers_kind_check" CHECK("kind" in ('warm-up', 'cool-down', 'hold'))
);
--> statement-breakpoint
INSERT INTO `__new_timers`("id", "bay_id", "job_line_id", "kind", "target_c", "ambient_c", "duration_seconds", "label", "started_at", "started_by", "reached_at", "ended_at") SELECT "id", "bay_id", "job_line_id", "kind", "target_c", "ambient_c", "duration_seconds", "label", "started_at", "started_by", "reached_at", "ended_at" FROM `timers`;--> statement-breakpoint
DROP TABLE `timers`;--> statement-breakpoint
ALTER TABLE `__new_timers` RENAME TO `timers`;--> statement-breakpoint
CREATE INDEX `timers_bay_id_ended_at_idx` ON `timers` (`bay_id`,`ended_at`);--> statement-breakpoint
CREATE TABLE `__new_findings` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_line_id` integer NOT NULL,
	`technician_id` integer NOT NULL,
	`note` text NOT NULL,
	`severity` text NOT NULL,
	`suggested_hours` real,
	`customer_wording` text,
	`book_hours` real,
	`parts_cents` integer,
	`answer` text DEFAULT 'pending' NOT NULL,
	`answer_channel` text,
	`answered_by` integer,
	`answered_name` text,
	`answered_at` integer,
	`created_line_id` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`job_line_id`) REFERENCES `job_lines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`technician_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`answered_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_line_id`) REFERENCES `job_lines`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "findings_severity_check" CHECK("severity" in ('safety-now', 'soon', 'watch')),
	CONSTRAINT "findings_answer_check" CHECK("answer" in ('pending', 'approved', 'declined')),
	CONSTRAINT "findings_answer_channel_check" CHECK("answer_channel" in ('link', 'phone', 'in-person'))
);
--> statement-breakpoint
INSERT INTO `__new_findings`("id", "job_line_id", "technician_id", "note", "severity", "suggested_hours", "customer_wording", "book_hours", "parts_cents", "answer", "answer_channel", "answered_by", "answered_name", "answered_at", "created_line_id", "created_at") SELECT "id", "job_line_id", "technician_id", "note", "severity", "suggested_hours", "customer_wording", "book_hours", "parts_cents", "answer", "answer_channel", "answered_by", "answered_name", "answered_at", "created_line_id", "created_at" FROM `findings`;--> statement-breakpoint
DROP TABLE `findings`;--> statement-breakpoint
ALTER TABLE `__new_findings` RENAME TO `findings`;--> statement-breakpoint
CREATE INDEX `findings_job_line_id_idx` ON `findings` (`job_line_id`);--> statement-breakpoint
CREATE INDEX `findings_answer_created_at_idx` ON `findings` (`answer`,`created_at`);--> statement-breakpoint
CREATE INDEX `findings_created_at_idx` ON `findings` (`created_at`);--> statement-breakpoint
CREATE TABLE `__new_mail_outbox` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`channel` text DEFAULT 'email' NOT NULL,
	`recipient` text NOT NULL,
	`subject` text,
	`text` text NOT NULL,
	`secret_body` integer DEFAULT false NOT NULL,
	`attachments` text,
	`status` text DEFAULT 'queued' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`next_attempt_at` integer NOT NULL,
	`last_error` text,
	`created_at` integer NOT NULL,
	`sent_at` integer,
	CONSTRAINT "mail_outbox_channel_check" CHECK("channel" in ('email', 'text')),
	CONSTRAINT "mail_outbox_status_check" CHECK("status" in ('queued', 'sent', 'failed'))
);
--> statement-breakpoint
INSERT INTO `__new_mail_outbox`("id", "channel", "recipient", "subject", "text", "secret_body", "attachments", "status", "attempts", "next_attempt_at", "last_error", "created_at", "sent_at") SELECT "id", "channel", "recipient", "subject", "text", "secret_body", "attachments", "status", "attempts", "next_attempt_at", "last_error", "created_at", "sent_at" FROM `mail_outbox`;--> statement-breakpoint
DROP TABLE `mail_outbox`;--> statement-breakpoint
ALTER TABLE `__new_mail_outbox` RENAME TO `mail_outbox`;--> statement-breakpoint
CREATE INDEX `mail_outbox_status_next_attempt_at_idx` ON `mail_outbox` (`status`,`next_attempt_at`);--> statement-breakpoint
CREATE TABLE `__new_webhook_deliveries` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`webhook_id` integer NOT NULL,
	`event` text NOT NULL,
	`body` text NOT NULL,
	`status` text DEFAULT 'pending' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`next_attempt_at` integer,
	`created_at` integer NOT NULL,
	`delivered_at` integer,
	FOREIGN KEY (`webhook_id`) REFERENCES `webhooks`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "webhook_deliveries_event_check" CHECK("event" in ('job-line.finished', 'repair-order.ready', 'finding.answered', 'pay-week.closed')),
	CONSTRAINT "webhook_deliveries_status_check" CHECK("status" in ('pending', 'delivered', 'failed'))
);
--> statement-breakpoint
INSERT INTO `__new_webhook_deliveries`("id", "webhook_id", "event", "body", "status", "attempts", "next_attempt_at", "created_at", "delivered_at") SELECT "id", "webhook_id", "event", "body", "status", "attempts", "next_attempt_at", "created_at", "delivered_at" FROM `webhook_deliveries`;--> statement-breakpoint
DROP TABLE `webhook_deliveries`;--> statement-breakpoint
ALTER TABLE `__new_webhook_deliveries` RENAME TO `webhook_deliveries`;--> statement-breakpoint
CREATE INDEX `webhook_deliveries_status_next_attempt_at_idx` ON `webhook_deliveries` (`status`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `webhook_deliveries_created_at_idx` ON `webhook_deliveries` (`created_at`);--> statement-breakpoint
CREATE TABLE `__new_approval_link_findings` (
	`link_id` integer NOT NULL,
	`finding_id` integer NOT NULL,
	`wording` text NOT NULL,
	`severity` text NOT NULL,
	`book_hours` real NOT NULL,
	`labour_rate_cents` integer NOT NULL,
	`parts_cents` integer,
	PRIMARY KEY(`link_id`, `finding_id`),
	FOREIGN KEY (`link_id`) REFERENCES `approval_links`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`finding_id`) REFERENCES `findings`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "approval_link_findings_severity_check" CHECK("severity" in ('safety-now', 'soon', 'watch'))
);
--> statement-breakpoint
INSERT INTO `__new_approval_link_findings`("link_id", "finding_id", "wording", "severity", "book_hours", "labour_rate_cents", "parts_cents") SELECT "link_id", "finding_id", "wording", "severity", "book_hours", "labour_rate_cents", "parts_cents" FROM `approval_link_findings`;--> statement-breakpoint
DROP TABLE `approval_link_findings`;--> statement-breakpoint
ALTER TABLE `__new_approval_link_findings` RENAME TO `approval_link_findings`;--> statement-breakpoint
CREATE INDEX `approval_link_findings_finding_id_idx` ON `approval_link_findings` (`finding_id`);--> statement-breakpoint
CREATE TABLE `__new_parts_holds` (
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
	FOREIGN KEY (`received_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "parts_holds_state_check" CHECK("state" in ('ordered', 'back-ordered'))
);
--> statement-breakpoint
INSERT INTO `__new_parts_holds`("id", "job_line_id", "part", "state", "supplier", "expected_at", "received_at", "received_by", "created_at", "updated_at") SELECT "id", "job_line_id", "part", "state", "supplier", "expected_at", "received_at", "received_by", "created_at", "updated_at" FROM `parts_holds`;--> statement-breakpoint
DROP TABLE `parts_holds`;--> statement-breakpoint
ALTER TABLE `__new_parts_holds` RENAME TO `parts_holds`;--> statement-breakpoint
CREATE UNIQUE INDEX `parts_holds_open_job_line_id_idx` ON `parts_holds` (`job_line_id`) WHERE "parts_holds"."received_at" is null;--> statement-breakpoint
CREATE INDEX `parts_holds_job_line_id_idx` ON `parts_holds` (`job_line_id`);--> statement-breakpoint
CREATE TABLE `__new_offline_punches` (
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
	FOREIGN KEY (`decided_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "offline_punches_kind_check" CHECK("kind" in ('shift-in', 'shift-out', 'break-start', 'break-end')),
	CONSTRAINT "offline_punches_break_kind_check" CHECK("break_kind" in ('meal', 'rest')),
	CONSTRAINT "offline_punches_status_check" CHECK("status" in ('unverified', 'refused', 'confirmed', 'rejected'))
);
--> statement-breakpoint
INSERT INTO `__new_offline_punches`("id", "kiosk_id", "badge", "technician_id", "kind", "break_kind", "at", "status", "problem", "received_at", "decided_at", "decided_by") SELECT "id", "kiosk_id", "badge", "technician_id", "kind", "break_kind", "at", "status", "problem", "received_at", "decided_at", "decided_by" FROM `offline_punches`;--> statement-breakpoint
DROP TABLE `offline_punches`;--> statement-breakpoint
ALTER TABLE `__new_offline_punches` RENAME TO `offline_punches`;--> statement-breakpoint
CREATE INDEX `offline_punches_status_at_idx` ON `offline_punches` (`status`,`at`);--> statement-breakpoint
CREATE INDEX `offline_punches_technician_id_status_idx` ON `offline_punches` (`technician_id`,`status`);