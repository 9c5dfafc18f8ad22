DROP INDEX `repair_orders_status_idx`;--> statement-breakpoint
ALTER TABLE `repair_orders` ADD `customer_name` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `repair_orders` ADD `customer_phone` text;--> statement-breakpoint
ALTER TABLE `repair_orders` ADD `customer_email` text;--> statement-breakpoint
ALTER TABLE `repair_orders` ADD `vehicle_year` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `repair_orders` ADD `vehicle_make` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `repair_orders` ADD `vehicle_model` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `repair_orders` ADD `vehicle_plate` text;--> statement-breakpoint
CREATE INDEX `repair_orders_status_created_at_idx` ON `repair_orders` (`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `repair_orders_created_at_idx` ON `repair_orders` (`created_at`);--> statement-breakpoint
CREATE INDEX `repair_orders_advisor_id_created_at_idx` ON `repair_orders` (`advisor_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `repair_orders_promised_at_idx` ON `repair_orders` (`promised_at`);--> statement-breakpoint
CREATE INDEX `repair_orders_vehicle_id_created_at_idx` ON `repair_orders` (`vehicle_id`,`created_at`);--> statement-breakpoint
DROP INDEX `punches_job_line_id_idx`;--> statement-breakpoint
CREATE INDEX `punches_job_line_id_at_idx` ON `punches` (`job_line_id`,`at`);--> statement-breakpoint
DROP INDEX `findings_answer_idx`;--> statement-breakpoint
CREATE INDEX `findings_answer_created_at_idx` ON `findings` (`answer`,`created_at`);--> statement-breakpoint
CREATE INDEX `findings_created_at_idx` ON `findings` (`created_at`);--> statement-breakpoint
CREATE INDEX `job_lines_open_idx` ON `job_lines` (`repair_order_id`) WHERE "job_lines"."status" != 'done';--> statement-breakpoint
CREATE INDEX `job_lines_completed_at_idx` ON `job_lines` (`completed_at`);