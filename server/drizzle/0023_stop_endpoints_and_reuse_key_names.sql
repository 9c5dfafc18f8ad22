PRAGMA foreign_keys=OFF;--> statement-breakpoint
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
	CONSTRAINT "webhook_deliveries_status_check" CHECK("status" in ('pending', 'delivered', 'failed', 'cancelled'))
);
--> statement-breakpoint
INSERT INTO `__new_webhook_deliveries`("id", "webhook_id", "event", "body", "status", "attempts", "next_attempt_at", "created_at", "delivered_at") SELECT "id", "webhook_id", "event", "body", "status", "attempts", "next_attempt_at", "created_at", "delivered_at" FROM `webhook_deliveries`;--> statement-breakpoint
DROP TABLE `webhook_deliveries`;--> statement-breakpoint
ALTER TABLE `__new_webhook_deliveries` RENAME TO `webhook_deliveries`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
CREATE INDEX `webhook_deliveries_status_next_attempt_at_idx` ON `webhook_deliveries` (`status`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `webhook_deliveries_created_at_idx` ON `webhook_deliveries` (`created_at`);--> statement-breakpoint
DROP INDEX `integration_keys_name_idx`;--> statement-breakpoint
CREATE UNIQUE INDEX `integration_keys_active_name_idx` ON `integration_keys` (`name`) WHERE "integration_keys"."revoked_at" is null;