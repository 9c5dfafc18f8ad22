CREATE TABLE `approval_link_findings` (
	`link_id` integer NOT NULL,
	`finding_id` integer NOT NULL,
	`wording` text NOT NULL,
	`severity` text NOT NULL,
	`book_hours` real NOT NULL,
	`labour_rate_cents` integer NOT NULL,
	`parts_cents` integer,
	PRIMARY KEY(`link_id`, `finding_id`),
	FOREIGN KEY (`link_id`) REFERENCES `approval_links`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`finding_id`) REFERENCES `findings`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `approval_link_findings_finding_id_idx` ON `approval_link_findings` (`finding_id`);--> statement-breakpoint
CREATE TABLE `approval_links` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`token_hash` text NOT NULL,
	`repair_order_id` integer NOT NULL,
	`sent_by` integer NOT NULL,
	`sent_to` text NOT NULL,
	`created_at` integer NOT NULL,
	`expires_at` integer NOT NULL,
	`revoked_at` integer,
	`revoked_by` integer,
	`used_at` integer,
	`signed_name` text,
	`answered_ip` text,
	`answered_user_agent` text,
	FOREIGN KEY (`repair_order_id`) REFERENCES `repair_orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`sent_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`revoked_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `approval_links_token_hash_idx` ON `approval_links` (`token_hash`);--> statement-breakpoint
CREATE INDEX `approval_links_repair_order_id_idx` ON `approval_links` (`repair_order_id`);--> statement-breakpoint
PRAGMA foreign_keys=OFF;--> statement-breakpoint
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
	`sent_at` integer
);
--> statement-breakpoint
INSERT INTO `__new_mail_outbox`("id", "channel", "recipient", "subject", "text", "secret_body", "attachments", "status", "attempts", "next_attempt_at", "last_error", "created_at", "sent_at") SELECT "id", 'email', "recipient", "subject", "text", 0, "attachments", "status", "attempts", "next_attempt_at", "last_error", "created_at", "sent_at" FROM `mail_outbox`;--> statement-breakpoint
DROP TABLE `mail_outbox`;--> statement-breakpoint
ALTER TABLE `__new_mail_outbox` RENAME TO `mail_outbox`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
CREATE INDEX `mail_outbox_status_next_attempt_at_idx` ON `mail_outbox` (`status`,`next_attempt_at`);--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `phone` text;--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `labour_rate_cents` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `tax_note` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `approval_link_hours` integer DEFAULT 72 NOT NULL;--> statement-breakpoint
ALTER TABLE `findings` ADD `customer_wording` text;--> statement-breakpoint
ALTER TABLE `findings` ADD `book_hours` real;--> statement-breakpoint
ALTER TABLE `findings` ADD `parts_cents` integer;--> statement-breakpoint
ALTER TABLE `findings` ADD `answer_channel` text;--> statement-breakpoint
ALTER TABLE `findings` ADD `answered_name` text;